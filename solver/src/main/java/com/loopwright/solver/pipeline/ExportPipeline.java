package com.loopwright.solver.pipeline;

import com.loopwright.solver.design.ClosedFormDesign;
import com.loopwright.solver.export.SampledLaw;
import com.loopwright.solver.export.SampledLawDesigner;
import com.loopwright.solver.export.SampledLawException;
import com.loopwright.solver.robustness.FeedbackGains;
import com.loopwright.solver.robustness.GridMetrics;
import com.loopwright.solver.robustness.SampledStepMetrics;
import java.util.Optional;

/**
 * The front door of the controller export: the emulated sampled law of a verified design and the step of the
 * sampled loop it makes. Every failure is a {@link SolverFailure}. Stateless and thread-safe.
 */
public final class ExportPipeline {

    private final SampledLawDesigner lawDesigner = new SampledLawDesigner();
    private final SampledStepMetrics sampledMetrics = new SampledStepMetrics();

    /**
     * @throws SolverFailure SAMPLED_LAW_INFEASIBLE with subject {@link SolverFailure#SAMPLE_PERIOD} or
     *                       {@link SolverFailure#COMMAND_LIMIT}
     */
    public ControllerExport export(DesignReport report, double samplePeriodSeconds, double commandLimit) {
        SampledLaw law;
        try {
            law = lawDesigner.emulate(report.design(), samplePeriodSeconds, commandLimit);
        } catch (SampledLawException e) {
            throw SolverFailure.about(SolverFailure.Kind.SAMPLED_LAW_INFEASIBLE, e.aboutSamplePeriod()
                    ? SolverFailure.SAMPLE_PERIOD : SolverFailure.COMMAND_LIMIT, -1, e.getMessage(), e);
        }
        ClosedFormDesign d = report.design();
        // the sampled loop's own step (not the continuous one): the header and the parameter set quote both
        Optional<GridMetrics> sampledStep = sampledMetrics.measure(d.plant(),
                new FeedbackGains(d.positionGain(), d.velocityGain(), d.referenceGain()), report.stepSize(),
                law.samplePeriodSeconds(), report.bandFraction());
        return new ControllerExport(report, law, sampledStep);
    }
}
