package org.leadline.workbench;

import org.leadline.surface.Grid;
import org.leadline.uncertainty.ComplianceSummary;
import org.leadline.uncertainty.CrosslineResult;

import java.util.List;

/**
 * What the Depth surface and Checks views show, built from the statuses of one moment: the grid,
 * the IHO S-44 compliance of the accepted soundings, and the crossline comparison.
 *
 * @param grid        the depth surface (layers depth, uncertainty, count, stddev)
 * @param accepted    accepted soundings with a position, the ones gridded
 * @param meanDepth   mean of the grid's finite depth cells, m
 * @param compliance  S-44 compliance for the project's order
 * @param crosslines  crossline comparison, or null when the project names no crossline
 * @param crosslineNames the lines compared as crosslines
 */
public record SurfaceState(Grid grid, int accepted, double meanDepth, ComplianceSummary compliance,
                           CrosslineResult crosslines, List<String> crosslineNames) {
    public SurfaceState {
        crosslineNames = List.copyOf(crosslineNames);
    }

    /** Mean of the finite cells of the grid's depth layer, m (NaN when none). */
    static double meanDepth(Grid g) {
        float[] d = g.layer(Grid.DEPTH);
        double sum = 0;
        int k = 0;
        for (float v : d) {
            if (Float.isFinite(v)) {
                sum += v;
                k++;
            }
        }
        return k == 0 ? Double.NaN : sum / k;
    }
}
