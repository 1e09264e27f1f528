package com.loopwright.solver.pipeline;

/**
 * Every text of one exported controller, with the file name each is saved under (built from the prefix).
 *
 * @param structuredTextFileName the Structured Text file name, {@code <prefix>_Controller.st}
 * @param structuredText         the IEC 61131-3 function block
 * @param cHeaderFileName        the C header's file name, {@code <prefix>.h}
 * @param cHeader                the C header: constants, state struct, prototypes
 * @param cSourceFileName        the C source's file name, {@code <prefix>.c}
 * @param cSource                the C source: the init and step functions
 * @param plcOpenXmlFileName     the PLCopen XML file name, {@code <prefix>_Controller.xml}
 * @param plcOpenXml             the PLCopen TC6 XML 2.01 project with the function block
 */
public record ControllerTexts(
        String structuredTextFileName,
        String structuredText,
        String cHeaderFileName,
        String cHeader,
        String cSourceFileName,
        String cSource,
        String plcOpenXmlFileName,
        String plcOpenXml) {}
