package org.leadline.cleaning;

import org.leadline.survey.SoundingTable;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.function.DoubleBinaryOperator;

/**
 * Synthetic forward model of a small survey for the cleaning tests (invented data, DESIGN.md
 * section 7): straight lines over a known seabed, soundings with normal noise of sigma = TVU/1.96,
 * and injected spikes (fish-like mid-water returns in small schools, second echoes at twice the
 * depth, dropouts with a zero raw depth). {@link #spike} marks the injected ones.
 */
final class SyntheticSurvey {
    static final double DRAFT = 1.0;       // transducer below the water surface, m
    static final double WATER_LEVEL = 0.4; // above chart datum, m

    final SoundingTable table;
    final boolean[] spike;
    final int spikes;

    private SyntheticSurvey(SoundingTable t, boolean[] spike) {
        this.table = t;
        this.spike = spike;
        int c = 0;
        for (boolean b : spike) if (b) c++;
        spikes = c;
    }

    /** TVU (95 %) of a sounding: an S-44-like a, b depth term growing off nadir (forward-model choice). */
    static double tvu(double depth, double angleRad) {
        double z = Math.abs(depth);
        return 1.96 * Math.sqrt(0.08 * 0.08 + 0.004 * z * 0.004 * z) / Math.sqrt(Math.cos(angleRad));
    }

    /**
     * @param ground    true reduced depth at (easting, northing), m
     * @param beams     beams per ping (1 = single beam, vertical)
     * @param lines     number of lines; even lines run east, odd lines run north
     * @param pings     pings per line
     * @param seed      random seed
     */
    static SyntheticSurvey make(DoubleBinaryOperator ground, int beams, int lines, int pings, long seed) {
        Random rnd = new Random(seed);
        List<String> names = new ArrayList<>();
        for (int l = 0; l < lines; l++) names.add(String.format("L%03d", l + 1));
        int n = lines * pings * beams;
        SoundingTable t = new SoundingTable(n, names);
        boolean[] spike = new boolean[n];
        double spacing = 1.0, dtPing = 0.5;
        int i = 0;
        for (int l = 0; l < lines; l++) {
            boolean east = l % 2 == 0;
            double ue = east ? 1 : 0, un = east ? 0 : 1;
            double ve = un, vn = -ue; // starboard
            double se = east ? 0 : 40 + 30 * l, sn = east ? 40 + 30 * l : 0;
            // fish schools: (ping, first beam, pings, beams, depth fraction)
            int schools = Math.max(1, pings / 60);
            int[][] school = new int[schools][4];
            double[] fishFrac = new double[schools];
            for (int k = 0; k < schools; k++) {
                school[k][0] = rnd.nextInt(pings);
                school[k][1] = rnd.nextInt(beams);
                school[k][2] = 1 + rnd.nextInt(3);
                school[k][3] = 1 + rnd.nextInt(Math.min(8, beams));
                fishFrac[k] = 0.2 + 0.6 * rnd.nextDouble();
            }
            for (int p = 0; p < pings; p++) {
                double pe = se + ue * p * spacing, pn = sn + un * p * spacing;
                double nadir = ground.applyAsDouble(pe, pn);
                for (int b = 0; b < beams; b++) {
                    double ang = beams == 1 ? 0 : Math.toRadians(-60 + 120.0 * b / (beams - 1));
                    double x = (nadir + WATER_LEVEL - DRAFT) * Math.tan(ang);
                    double fe = pe + ve * x, fn = pn + vn * x;
                    double z = ground.applyAsDouble(fe, fn);
                    double d = z + rnd.nextGaussian() * tvu(z, ang) / 1.96;
                    boolean bad = false;
                    for (int k = 0; k < schools; k++) {
                        if (p >= school[k][0] && p < school[k][0] + school[k][2]
                                && b >= school[k][1] && b < school[k][1] + school[k][3]) {
                            d = fishFrac[k] * z + 0.3 * rnd.nextGaussian();
                            bad = true;
                        }
                    }
                    double u = rnd.nextDouble();
                    if (u < 0.003) { // second echo
                        d = 2 * (z + WATER_LEVEL - DRAFT) + DRAFT - WATER_LEVEL + 0.2 * rnd.nextGaussian();
                        bad = true;
                    } else if (u < 0.006) { // dropout: raw depth 0 below the transducer
                        d = DRAFT - WATER_LEVEL;
                        bad = true;
                    }
                    t.time[i] = 1.7e9 + l * 3600 + p * dtPing;
                    t.line[i] = l;
                    t.beam[i] = beams == 1 ? -1 : b;
                    t.easting[i] = fe;
                    t.northing[i] = fn;
                    t.depth[i] = d;
                    t.surfaceDepth[i] = d + WATER_LEVEL;
                    t.launchAngle[i] = ang;
                    t.acrossTrack[i] = x;
                    t.tvu[i] = tvu(d, ang); // as the TPU stage would: from the measured depth
                    spike[i] = bad;
                    i++;
                }
            }
        }
        return new SyntheticSurvey(t, spike);
    }

    /** {rejected spikes / spikes, rejected good / good}. */
    double[] rates() {
        int rs = 0, rg = 0;
        for (int k = 0; k < table.size; k++) {
            if (!table.accepted(k)) {
                if (spike[k]) rs++;
                else rg++;
            }
        }
        return new double[] {rs / (double) spikes, rg / (double) (table.size - spikes)};
    }
}
