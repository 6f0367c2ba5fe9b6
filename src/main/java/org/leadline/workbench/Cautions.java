package org.leadline.workbench;

import javax.swing.JOptionPane;
import java.awt.Component;

/** The cautions the workbench shows on first start and in Help > About. */
public final class Cautions {
    private Cautions() {}

    /** The caution text (plain). */
    public static final String TEXT = "Leadline is not for navigation unless its results are validated by a qualified"
            + " hydrographer.\n\nLocal regulations, the charting authority and licensed practice prevail over"
            + " anything this program computes or shows.";

    /** Preference key remembering that the cautions were acknowledged. */
    static final String ACKNOWLEDGED = "cautionsAcknowledged";

    /** Title of the first-start dialog (the GUI test finds the dialog by it). */
    public static final String TITLE = "Leadline: cautions";

    /**
     * Shows the cautions in a modal dialog the first time the workbench starts for this user
     * (remembered in the preferences once acknowledged).
     *
     * @return true when the dialog was shown
     */
    static boolean showOnFirstStart(Component parent, WorkbenchPrefs prefs) {
        if (prefs.cautionsAcknowledged()) return false;
        JOptionPane.showMessageDialog(parent, TEXT, TITLE, JOptionPane.WARNING_MESSAGE);
        prefs.acknowledgeCautions();
        return true;
    }
}
