package com.loopwright.solver.robustness;

import com.loopwright.solver.cancel.Cancellation;
import com.loopwright.solver.design.DisturbanceResponse;
import com.loopwright.solver.design.FeedbackGains;
import com.loopwright.solver.numeric.SafeRounding;
import com.loopwright.solver.plant.CanonicalPlant;
import com.loopwright.solver.plant.DisturbanceProfile;
import com.loopwright.solver.simulation.DisturbanceSimulator;
import java.util.ArrayList;
import java.util.List;
import org.ejml.data.DMatrixRMaj;

/** Each disturbance profile simulated, its observed w-to-z gain judged against the H-infinity norm and gamma. */
final class DisturbanceRejection {

    /** Relative slack on observedGain &lt;= hinfNorm for the norm's stated accuracy. */
    static final double NORM_SLACK = 1e-8;

    private final DisturbanceSimulator disturbance = new DisturbanceSimulator();

    /**
     * @param gamma the design's certified bound on the w-to-z gain, or null
     * @throws CapExceededException when a profile ends later than the cap of nominal horizons
     */
    List<DisturbanceCheck> run(
            CanonicalPlant plant,
            FeedbackGains gains,
            List<DisturbanceProfile> profiles,
            DMatrixRMaj performanceOutput,
            double hinfNorm,
            Double gamma,
            double horizonSeconds) {
        List<DisturbanceCheck> checks = new ArrayList<>(profiles.size());
        for (int i = 0; i < profiles.size(); i++) {
            Cancellation.checkpoint();
            DisturbanceProfile profile = profiles.get(i);
            double from = profile.settledFromSeconds();
            double cap = RobustnessVerifier.MAX_DISTURBANCE_TIMING_HORIZONS * horizonSeconds;
            if (from > cap) {
                throw new CapExceededException(
                        CapExceededException.Option.DISTURBANCE_TIMING,
                        i,
                        String.format(
                                "the disturbance must be over by %.6g s (%s nominal horizons of %.6g s), it ends at %.6g s",
                                SafeRounding.atMost(cap, RobustnessVerifier.ADVICE_DIGITS),
                                RobustnessVerifier.fmt(RobustnessVerifier.MAX_DISTURBANCE_TIMING_HORIZONS),
                                horizonSeconds,
                                from));
            }
            DisturbanceResponse response = disturbance.simulate(
                    plant, gains, profile, performanceOutput, from >= 0 ? from + horizonSeconds : horizonSeconds);
            checks.add(new DisturbanceCheck(
                    profile,
                    response,
                    response.observedGain() <= hinfNorm * (1 + NORM_SLACK),
                    gamma == null ? Verdict.NOT_JUDGED : Verdict.of(response.observedGain() <= gamma)));
        }
        return checks;
    }
}
