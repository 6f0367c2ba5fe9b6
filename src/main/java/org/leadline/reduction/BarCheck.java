package org.leadline.reduction;

import org.apache.commons.math3.stat.regression.SimpleRegression;

/**
 * Bar check: a plate or bar lowered under the transducer to known depths, each compared with the
 * sounder's reading. The model is {@code barDepth = indexCorrection + scale * reading}: the scale
 * is the ratio of the true mean sound speed to the sounder's set speed, the index correction the
 * fixed offset (draft error, electronic delay). Fitted by ordinary least squares (Commons Math
 * {@link SimpleRegression}); standard errors from the residual variance with n - 2 degrees of
 * freedom (e.g. Draper and Smith 1998, "Applied Regression Analysis", ch. 1). The bar check
 * procedure itself is described in IHO C-13 "Manual on Hydrography" (2005), ch. 3 (from memory).
 *
 * <p>Accuracy: to rounding; standard errors need at least three pairs.
 */
public final class BarCheck {
    private BarCheck() {}

    /**
     * Result of a bar check fit.
     *
     * @param indexCorrection    fixed correction added to readings, m
     * @param scale              sound-speed scale (true mean speed / set speed), dimensionless
     * @param indexCorrectionSe  standard error of the index correction, m (NaN with fewer than 3 pairs)
     * @param scaleSe            standard error of the scale (NaN with fewer than 3 pairs)
     * @param residuals          bar depth minus fitted depth per pair, m
     * @param rms                root-mean-square residual, m
     */
    public record Result(double indexCorrection, double scale, double indexCorrectionSe, double scaleSe,
                         double[] residuals, double rms) {
        /** The mean sound speed implied by the scale for a sounder set to setSpeed, m/s. */
        public double impliedSoundSpeed(double setSpeed) {
            return scale * setSpeed;
        }

        /** Corrected depth for a sounder reading, m. */
        public double correct(double reading) {
            return indexCorrection + scale * reading;
        }
    }

    /**
     * Fits index correction and scale.
     *
     * @param barDepth known depths of the bar, m
     * @param reading  sounder readings at those depths, m
     */
    public static Result fit(double[] barDepth, double[] reading) {
        if (barDepth.length != reading.length) {
            throw new IllegalArgumentException("bar check needs pairs: " + barDepth.length + " depths, "
                    + reading.length + " readings");
        }
        if (barDepth.length < 2) {
            throw new IllegalArgumentException("bar check needs at least two depths, got " + barDepth.length);
        }
        SimpleRegression reg = new SimpleRegression(true);
        for (int i = 0; i < barDepth.length; i++) reg.addData(reading[i], barDepth[i]);
        double scale = reg.getSlope();
        double ic = reg.getIntercept();
        if (!Double.isFinite(scale)) {
            throw new IllegalArgumentException("bar check readings must span more than one depth");
        }
        double[] res = new double[barDepth.length];
        double ss = 0;
        for (int i = 0; i < res.length; i++) {
            res[i] = barDepth[i] - (ic + scale * reading[i]);
            ss += res[i] * res[i];
        }
        boolean enough = barDepth.length >= 3;
        return new Result(ic, scale, enough ? reg.getInterceptStdErr() : Double.NaN,
                enough ? reg.getSlopeStdErr() : Double.NaN, res, Math.sqrt(ss / res.length));
    }
}
