package org.leadline.uncertainty;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.leadline.reduction.Reducer;
import org.leadline.survey.PingTable;
import org.leadline.survey.SoundingTable;
import org.leadline.survey.Vessel;

import java.util.Random;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Monte Carlo check of the TPU model through the real reduction chain ({@link Reducer}): every
 * sensor input the chain takes is perturbed by its stated one-sigma value, the sounding is reduced
 * again, and the sample spread of the reduced depth must match the propagated TVU / 1.96 within
 * 10 % (issue acceptance), and the 95 % horizontal radius must match THU within 10 %.
 *
 * <p>Two inputs have no counterpart in the chain and are set to zero in this vessel: the sound
 * speed at the transducer (beam steering of a flat array; the chain takes angles as given) and the
 * beam footprint (a detection point inside the beam is not an input of the reduction).
 */
class TpuThroughReductionTest {
    static final double C = 1490.0;

    @ParameterizedTest(name = "beam {0} deg")
    @ValueSource(doubles = {0.0, 30.0, 45.0, 60.0})
    void sampleSpreadMatchesPropagatedUncertainty(double beamDeg) {
        Vessel.SensorSigmas sig = new Vessel.SensorSigmas(0.02, 0.002, 0.0, 2.0, 0.02, 0.03, 0.05, 0.05,
                Math.toRadians(0.1), Math.toRadians(0.1), Math.toRadians(0.2), 0.3, 0.01, 0.02, 0.03, 0.04);
        Vessel nominal = vessel(0.9, 0.05, new Vessel.Offset(0.3, -0.2, -2.5), new Vessel.Offset(1.1, 0.4, 0.8), sig);
        double depthBelowTransducer = 20.0, sog = 2.5, heading = 35.0;
        double theta = Math.toRadians(beamDeg);
        double range = depthBelowTransducer / Math.cos(theta);
        double twtt = 2 * range / C;
        double lat0 = 51.0, lon0 = 2.0;

        Random rnd = new Random(20261202L + (long) beamDeg);
        int n = 20000;
        double[] depth = new double[n], east = new double[n], north = new double[n];
        double tideSigma = Math.hypot(sig.waterLevel(), sig.tideZone());
        for (int k = 0; k < n; k++) {
            Vessel v = vessel(0.9 + rnd.nextGaussian() * sig.draft(), 0.05 + rnd.nextGaussian() * sig.settlement(),
                    jitter(nominal.positionOffset(), sig.leverArm(), rnd), jitter(nominal.transducerOffset(), sig.leverArm(), rnd), sig);
            double sr = Math.hypot(sig.sounderFixed(), sig.sounderRelative() * range);
            double t = twtt + 2 * rnd.nextGaussian() * sr / C;
            double c = C + rnd.nextGaussian() * sig.soundSpeedProfile();
            Reducer.BeamTracer straight = (z0, th, time, out) -> {
                out[0] = c * time * Math.cos(th);
                out[1] = c * time * Math.sin(th);
            };
            // position error per axis plus latency x speed along track (heading 35 deg)
            double along = rnd.nextGaussian() * sig.latency() * sog;
            double dN = rnd.nextGaussian() * sig.position() + along * Math.cos(Math.toRadians(heading));
            double dE = rnd.nextGaussian() * sig.position() + along * Math.sin(Math.toRadians(heading));
            double lat = lat0 + Math.toDegrees(dN / 6371000.0), lon = lon0 + Math.toDegrees(dE / (6371000.0 * Math.cos(Math.toRadians(lat0))));
            double heave = rnd.nextGaussian() * sig.heaveFixed();
            double roll = Math.toDegrees(rnd.nextGaussian() * sig.roll());
            double pitch = Math.toDegrees(rnd.nextGaussian() * sig.pitch());
            double hdg = heading + Math.toDegrees(rnd.nextGaussian() * sig.heading());
            double wl = 1.0 + rnd.nextGaussian() * tideSigma;
            PingTable p = new PingTable.Builder().add(0, lat, lon, t, Double.NaN, beamDeg == 0 ? 1e-9 : beamDeg,
                    hdg, heave, roll, pitch, "MC", 0, -1).build();
            Reducer.MergedInputs in = new Reducer.MergedInputs(p.lat, p.lon, p.heading, p.heave, p.roll, p.pitch,
                    new double[]{sog}, null);
            SoundingTable s = new Reducer(v, false).reduce(p, in, new Reducer.BeamTracer[]{straight},
                    new Reducer.CastChoice(new int[1], new int[1], null), (tt, la, lo) -> wl, (la, lo, e, no) -> {});
            depth[k] = s.depth[0];
            north[k] = Math.toRadians(s.lat[0] - lat0) * 6371000.0;
            east[k] = Math.toRadians(s.lon[0] - lon0) * 6371000.0 * Math.cos(Math.toRadians(lat0));
        }
        double sdDepth = std(depth);
        double y = depthBelowTransducer * Math.tan(theta);
        TpuBreakdown b = new TpuModel(nominal).breakdown(depthBelowTransducer, y, 0, C, sog, sig.tideZone());
        assertThat(sdDepth / (b.tvu() / 1.96)).as("sample sigma / propagated sigma, vertical").isBetween(0.9, 1.1);

        // 95 % horizontal radius of the sample about its mean, against THU
        double me = mean(east), mn = mean(north);
        double[] rad = new double[n];
        for (int k = 0; k < n; k++) rad[k] = Math.hypot(east[k] - me, north[k] - mn);
        java.util.Arrays.sort(rad);
        double r95 = rad[(int) (0.95 * n)];
        assertThat(r95 / b.thu()).as("sample 95 %% radius / THU").isBetween(0.9, 1.1);
    }

    private static Vessel vessel(double draft, double settlement, Vessel.Offset pos, Vessel.Offset tx, Vessel.SensorSigmas s) {
        return new Vessel(draft, new double[]{0}, new double[]{settlement}, pos, tx, 0, C, 1e-6, s);
    }

    private static Vessel.Offset jitter(Vessel.Offset o, double sigma, Random r) {
        return new Vessel.Offset(o.x() + r.nextGaussian() * sigma, o.y() + r.nextGaussian() * sigma, o.z() + r.nextGaussian() * sigma);
    }

    private static double mean(double[] x) {
        double m = 0;
        for (double v : x) m += v;
        return m / x.length;
    }

    private static double std(double[] x) {
        double m = mean(x), s = 0;
        for (double v : x) s += (v - m) * (v - m);
        return Math.sqrt(s / (x.length - 1));
    }
}
