package com.loopwright.solver.spec;

import java.util.List;

/** Where the n - 2 auxiliary poles go relative to the dominant pair. */
public sealed interface AuxiliaryPlacement permits AuxiliaryPlacement.RealPartMultiple, AuxiliaryPlacement.Explicit {

    DesiredPoles place(TargetDynamics dominant, int order);

    /** Real poles at multiple x the dominant real part (they follow the dominant pair when it moves). */
    record RealPartMultiple(double multiple) implements AuxiliaryPlacement {
        @Override
        public DesiredPoles place(TargetDynamics dominant, int order) {
            return DesiredPoles.atMultiple(dominant, order, multiple);
        }
    }

    /** Fixed poles given by the caller. */
    record Explicit(List<TargetDynamics.Pole> poles) implements AuxiliaryPlacement {
        public Explicit {
            poles = List.copyOf(poles);
        }

        @Override
        public DesiredPoles place(TargetDynamics dominant, int order) {
            return new DesiredPoles(dominant, poles);
        }
    }
}
