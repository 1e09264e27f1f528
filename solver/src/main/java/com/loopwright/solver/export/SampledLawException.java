package com.loopwright.solver.export;

/** The law cannot be run at the requested sample period or limit; the message says why in engineering words. */
public final class SampledLawException extends RuntimeException {

    private final boolean aboutSamplePeriod;

    public SampledLawException(String message, boolean aboutSamplePeriod) {
        super(message);
        this.aboutSamplePeriod = aboutSamplePeriod;
    }

    /** True when the sample period is the offending quantity, false when the actuator limit is. */
    public boolean aboutSamplePeriod() {
        return aboutSamplePeriod;
    }
}
