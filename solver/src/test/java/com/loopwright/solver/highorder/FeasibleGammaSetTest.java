package com.loopwright.solver.highorder;

import static org.junit.jupiter.api.Assertions.*;

import com.loopwright.solver.design.GammaChoice;
import com.loopwright.solver.design.InfeasibleDesignException;
import com.loopwright.solver.spec.DesignSpec;
import com.loopwright.solver.spec.TargetDynamics;
import com.loopwright.solver.spec.TimeSpec;
import java.util.List;
import org.junit.jupiter.api.Test;

class FeasibleGammaSetTest {

    private final HighOrderDesigner designer = new HighOrderDesigner();
    private final FeasibleGammaSearch search = new FeasibleGammaSearch();

    static DesiredPoles matched(CompanionPlant plant, double overshootPercent, double settling, double band) {
        DesignSpec spec = new DesignSpec(overshootPercent / 100, new TimeSpec.SettlingTime(settling, band));
        AuxiliaryPlacement placement = new AuxiliaryPlacement.RealPartMultiple(4);
        SpecMatch match = new SpecMatcher().match(plant, spec, placement, 1, 10);
        return placement.place(match.target(), plant.order());
    }

    @Test
    void explore() {
        CompanionPlant p2 = new CompanionPlant(
                new double[] {116.18020871989592, 143.70716638812533, 88.57936923160051, 30.503422892081126,
                        7.383026668401097},
                new double[] {1.0, -0.07477891545821842, 0, 0, 0}, 9.239987350768951,
                new double[] {-0.011479745058412868, 0.005237289926014479, -0.09520698703810945, -0.01578820225853452,
                        -0.03225289088209848});
        DesiredPoles poles2 = matched(p2, 1.8545524264102118, 1.1425650820161488, 0.05);
        var set2 = search.search(p2, poles2.coefficients());
        System.out.println("case2 " + set2.intervals() + " ev " + set2.evaluations() + " notes " + set2.notes());
        try {
            HighOrderDesign d = designer.design(p2, poles2, new GammaChoice.Fixed(9));
            System.out.println("case2 gamma9 " + java.util.Arrays.toString(d.weights()) + " " + d.notes());
        } catch (RuntimeException e) {
            System.out.println("case2 fail " + e);
        }
        CompanionPlant p3 = new CompanionPlant(
                new double[] {0.0, 24.97941139170825, 134.5277526057287, 169.3013746965912, 123.65431526377886,
                        38.52871463226239, 8.882909324515014},
                new double[] {1, 0, 0, 0, 0, 0, 0}, 0.04324120581504016,
                new double[] {7.7270514615083, -4.699242623990899, 6.92906458125667, 1.7780545876755274,
                        -1.5050091596285124, -4.120016176140748, 5.0987200947974});
        DesiredPoles poles3 = matched(p3, 5.483595520321292, 4.27809291643725, 0.02);
        var set3 = search.search(p3, poles3.coefficients());
        System.out.println("case3 " + set3.intervals() + " ev " + set3.evaluations() + " notes " + set3.notes());
        CompanionPlant p4 = new CompanionPlant(
                new double[] {-4664.394958744662, 10563.774241076499, 4285.479299120085, 580.1103571483848,
                        35.17298130085375},
                new double[] {1.0, 0.42082210235868306, 0, 0, 0}, 4981.713964800213,
                new double[] {-87.57057439775919, 222.93044269608208, -920.389020662208, 8698.501577157102,
                        -28721.24165932483});
        DesignSpec spec4 = new DesignSpec(0.003424922914388982, new TimeSpec.SettlingTime(2.055015615852868, 0.05));
        TargetDynamics t4 = new com.loopwright.solver.spec.SpecInverter().invert(spec4).target();
        DesiredPoles poles4 = new AuxiliaryPlacement.Explicit(List.of(new TargetDynamics.Pole(-15.945617686966436, 0),
                new TargetDynamics.Pole(-21.564618342946243, 0), new TargetDynamics.Pole(-17.05786188395355, 0)))
                .place(t4, 5);
        var set4 = search.search(p4, poles4.coefficients());
        System.out.println("case4 " + set4.intervals() + " ev " + set4.evaluations() + " notes " + set4.notes());
        try {
            HighOrderDesign d = designer.design(p4, poles4, new GammaChoice.Fixed(300));
            System.out.println("case4 gamma300 " + java.util.Arrays.toString(d.weights()) + " " + d.notes());
        } catch (RuntimeException e) {
            System.out.println("case4 fail " + e);
        }
    }
}
