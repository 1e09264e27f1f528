package com.loopwright.solver.plant;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.ejml.dense.row.SingularOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * A general two-state model x' = A x + B2 u + B1 w in the caller's own coordinates, both states measured.
 *
 * <p>If (A, B2) is controllable, x = T z takes it to the canonical form z1' = z2,
 * z2' = -a0 z1 - a1 z2 + b u + d w with s^2 + a1 s + a0 = det(sI - A) (a1 = -trace A, a0 = det A) and
 * T = C_x C_z^-1, where C_x = [B2, A B2] and C_z = [[0, b], [b, -a1 b]] are the controllability matrices
 * (Cayley-Hamilton: T A_c = A T and T B_c = B2). Then z1 = c x with c = b times the second row of C_x^-1:
 * its direction is fixed by (A, B2), and we choose b so that the entry of c largest in magnitude is exactly 1.
 * When the tracked output is one of the caller's states (a position), z1 is that state in its own units, and
 * a model already in canonical form gets T = I for either sign of b.
 *
 * <p>Conditioning: every conversion to and from canonical coordinates goes through C_x, so results in the
 * caller's coordinates carry relative errors up to about cond(C_x) times the unit roundoff (1.1e-16) even when
 * each step is backward stable. {@link #controllabilityCondition()} states cond_2(C_x) = sigma_max / sigma_min;
 * above {@link #CONDITION_NOTE_THRESHOLD} the response carries a note. T^-1 = C_z C_x^-1 is formed by an LU solve
 * with C_x itself (not by inverting the product T), so the inverse adds no second ill-conditioned step.
 *
 * <p>The canonical design assumes the disturbance enters like the actuator, T^-1 B1 = [0, d]', which holds
 * exactly when B1 = (d/b) B2 (the second column of T is B2/b). Any other B1 also drives the position-like
 * canonical state and is rejected.
 */
public final class TwoStateModel implements PlantForm {

    /** (A, B2) counts as uncontrollable when |det C_x| &lt;= this times ||B2|| ||A B2|| (or B2 = 0). */
    public static final double CONTROLLABILITY_TOLERANCE = 1e-9;
    /**
     * Above this 2-norm condition number of C_x = [B2, A B2] the response notes that the caller-coordinate
     * results (gain, P, tracked output, reference gain) may have lost up to log10(cond) of their ~16 digits:
     * 1e6 keeps at least about 10 correct digits below it.
     */
    public static final double CONDITION_NOTE_THRESHOLD = 1e6;
    /** T^-1 B1 must have |first entry| &lt;= this times its norm. */
    public static final double DISTURBANCE_ALIGNMENT_TOLERANCE = 1e-9;

    private final DMatrixRMaj a;
    private final DMatrixRMaj b2;
    private final DMatrixRMaj b1;
    private final DMatrixRMaj transform;
    private final DMatrixRMaj inverseTransform;
    private final CanonicalPlant canonical;
    private final DMatrixRMaj controllability;
    private final double controllabilityCondition;

    /**
     * @param a  2 x 2 state matrix
     * @param b2 actuator input vector (2 entries)
     * @param b1 disturbance input vector (2 entries; zero for none)
     * @throws PlantParameterException when (A, B2) is not controllable or B1 is not aligned with the
     *     velocity-like channel of the canonical form
     */
    public TwoStateModel(double[][] a, double[] b2, double[] b1) {
        this.a = new DMatrixRMaj(new double[][] {{a[0][0], a[0][1]}, {a[1][0], a[1][1]}});
        this.b2 = new DMatrixRMaj(2, 1, true, b2[0], b2[1]);
        this.b1 = new DMatrixRMaj(2, 1, true, b1[0], b1[1]);
        DMatrixRMaj ab2 = new DMatrixRMaj(2, 1);
        CommonOps_DDRM.mult(this.a, this.b2, ab2);
        DMatrixRMaj cx = new DMatrixRMaj(new double[][] {{b2[0], ab2.get(0)}, {b2[1], ab2.get(1)}});
        double detCx = CommonOps_DDRM.det(cx);
        double scale = NormOps_DDRM.normF(this.b2) * NormOps_DDRM.normF(ab2);
        if (!(scale > 0) || !(Math.abs(detCx) > CONTROLLABILITY_TOLERANCE * scale)) {
            throw new PlantParameterException(
                    "b2",
                    "the model is not controllable: the actuator input B2 and"
                            + " A B2 are parallel (or B2 is zero), so the actuator cannot move both states independently"
                            + " and no state feedback can place both closed-loop poles");
        }
        // + 0.0 turns a negative zero into zero.
        double a1 = -(a[0][0] + a[1][1]) + 0.0;
        double a0 = CommonOps_DDRM.det(this.a) + 0.0;
        // z1 = c x with c = b (second row of C_x^-1): the direction is fixed, b sets its scale.
        DMatrixRMaj cxInv = new DMatrixRMaj(2, 2);
        CommonOps_DDRM.invert(cx, cxInv);
        double r0 = cxInv.get(1, 0);
        double r1 = cxInv.get(1, 1);
        double b = 1 / (Math.abs(r0) >= Math.abs(r1) ? r0 : r1);
        DMatrixRMaj t = transformFor(cx, a1, b);
        // T^-1 = C_z C_x^-1, i.e. C_x^T (T^-1)^T = C_z^T: one LU solve with C_x (C_z is symmetric)
        DMatrixRMaj cz = new DMatrixRMaj(new double[][] {{0, b}, {b, -a1 * b}});
        DMatrixRMaj tInv = solveTransposed(cx, cz);
        DMatrixRMaj b1z = new DMatrixRMaj(2, 1);
        CommonOps_DDRM.mult(tInv, this.b1, b1z);
        double b1zNorm = NormOps_DDRM.normF(b1z);
        if (Math.abs(b1z.get(0)) > DISTURBANCE_ALIGNMENT_TOLERANCE * b1zNorm) {
            throw new PlantParameterException(
                    "b1",
                    String.format(
                            "the disturbance input B1 is not a multiple of"
                                    + " the actuator input B2: in canonical coordinates it also drives the position-like state"
                                    + " (T^-1 B1 = [%.6g, %.6g]), which the closed-form design does not cover; model the"
                                    + " disturbance as entering where the actuator acts (B1 = (d/b) B2)",
                            b1z.get(0), b1z.get(1)));
        }
        this.transform = t;
        this.inverseTransform = tInv;
        this.controllability = cx;
        double[] singular = SingularOps_DDRM.singularValues(cx.copy());
        double largest = Math.max(singular[0], singular[1]);
        double smallest = Math.min(singular[0], singular[1]);
        this.controllabilityCondition = smallest > 0 ? largest / smallest : Double.MAX_VALUE;
        this.canonical = PhysicalCheck.canonical(a0, a1, b, b1z.get(1), b1zNorm > 0);
    }

    /**
     * X with X C_x = M, i.e. X = M C_x^-1, from the LU solve C_x^T X^T = M^T (partial pivoting), not from an
     * explicit inverse. M has 2 columns and any number of rows.
     */
    public static DMatrixRMaj solveTransposed(DMatrixRMaj cx, DMatrixRMaj m) {
        DMatrixRMaj cxTransposed = new DMatrixRMaj(2, 2);
        CommonOps_DDRM.transpose(cx, cxTransposed);
        DMatrixRMaj mTransposed = new DMatrixRMaj(m.numCols, m.numRows);
        CommonOps_DDRM.transpose(m, mTransposed);
        LinearSolverDense<DMatrixRMaj> lu = LinearSolverFactory_DDRM.lu(2);
        if (!lu.setA(cxTransposed)) {
            throw new PlantParameterException("b2", "the controllability matrix [B2, A B2] is singular");
        }
        DMatrixRMaj xTransposed = new DMatrixRMaj(2, m.numRows);
        lu.solve(mTransposed, xTransposed);
        DMatrixRMaj x = new DMatrixRMaj(m.numRows, 2);
        CommonOps_DDRM.transpose(xTransposed, x);
        return x;
    }

    /** T = C_x C_z^-1 with C_z = [[0, b], [b, -a1 b]], C_z^-1 = [[a1/b, 1/b], [1/b, 0]]. */
    private static DMatrixRMaj transformFor(DMatrixRMaj cx, double a1, double b) {
        DMatrixRMaj czInv = new DMatrixRMaj(new double[][] {{a1 / b, 1 / b}, {1 / b, 0}});
        DMatrixRMaj t = new DMatrixRMaj(2, 2);
        CommonOps_DDRM.mult(cx, czInv, t);
        return t;
    }

    @Override
    public CanonicalPlant canonical() {
        return canonical;
    }

    /** A (copy). */
    public DMatrixRMaj a() {
        return a.copy();
    }

    /** B2 (copy). */
    public DMatrixRMaj b2() {
        return b2.copy();
    }

    /** B1 (copy). */
    public DMatrixRMaj b1() {
        return b1.copy();
    }

    /** T with x = T z (copy). */
    public DMatrixRMaj transform() {
        return transform.copy();
    }

    /** C_x = [B2, A B2] (copy). */
    public DMatrixRMaj controllabilityMatrix() {
        return controllability.copy();
    }

    /** cond_2(C_x) = sigma_max / sigma_min of C_x = [B2, A B2] ({@link Double#MAX_VALUE} if singular). */
    public double controllabilityCondition() {
        return controllabilityCondition;
    }

    /** True when {@link #controllabilityCondition()} exceeds {@link #CONDITION_NOTE_THRESHOLD}. */
    public boolean illConditioned() {
        return controllabilityCondition > CONDITION_NOTE_THRESHOLD;
    }

    /** T^-1 with z = T^-1 x (copy). */
    public DMatrixRMaj inverseTransform() {
        return inverseTransform.copy();
    }
}
