package com.loopwright.solver.export;

import com.loopwright.solver.discrete.ControllerFixtures;
import com.loopwright.solver.discrete.ControllerSettings;
import com.loopwright.solver.discrete.DiscreteController;
import java.util.List;

/** The three test controllers with their plant sensing, and a provenance header. */
final class ControllerExportFixtures {

    /** A controller with the plant output its y measures. */
    record Case(String name, DiscreteController controller, double[][] measured) {
        ControllerSettings settings() {
            return ControllerFixtures.settings(controller.measuredCount());
        }

        ControllerExportOptions options(String prefix, Precision precision) {
            return new ControllerExportOptions(new BlockPrefix(prefix), precision, settings());
        }
    }

    private ControllerExportFixtures() {}

    static List<Case> cases() {
        return List.of(
                new Case("plain law", ControllerFixtures.plainLaw(), ControllerFixtures.fullState()),
                new Case(
                        "full state, integrator",
                        ControllerFixtures.fullStateWithIntegrator(),
                        ControllerFixtures.fullState()),
                new Case(
                        "position only, observer and integrator",
                        ControllerFixtures.observerWithIntegrator(),
                        ControllerFixtures.positionOnly()));
    }

    static ProvenanceHeader header() {
        return new ProvenanceHeader(
                "Packaging-line indexing axis 1",
                "0.1.0-test",
                "sha256:0123abcd",
                "G(s) = 400 / (s (s + 0.48)), x1 in m, u in A",
                List.of("settling time 0.15 s (2% band)", "overshoot 1.5%"),
                1.25,
                List.of("Commission with GainScale 0.5 first; this block provides no safety function (*/ *) test)."));
    }
}
