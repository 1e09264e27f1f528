/**
 * Time-domain specs and their exact inversion to the target dynamics s^2 + 2 zeta wn s + wn^2: damping ratio
 * from the percent overshoot, natural frequency from the exact normalized settling or rise time (no 4/(zeta wn)
 * estimate). Invariant: every inversion returns zeta in (0, 1] and wn > 0 or refuses the spec; nothing here
 * depends on a plant. The order-n target (the dominant pair plus auxiliary poles: {@code DesiredPoles},
 * {@code AuxiliaryPlacement}) is stated here too.
 */
package com.loopwright.solver.spec;
