package com.loopwright.solver.export;

/**
 * Every text of one exported controller.
 *
 * @param structuredText the IEC 61131-3 function block
 * @param cHeaderFileName the C header's file name, {@code <prefix>.h}
 * @param cHeader        the C header: constants, state struct, prototypes
 * @param cSourceFileName the C source's file name, {@code <prefix>.c}
 * @param cSource        the C source: the init and step functions
 * @param plcOpenXml     the PLCopen TC6 XML 2.01 project with the function block
 */
public record ControllerTexts(
        String structuredText,
        String cHeaderFileName,
        String cHeader,
        String cSourceFileName,
        String cSource,
        String plcOpenXml) {}
