package org.leadline.uncertainty;

/**
 * The error sources of the {@link TpuModel}, after Hare, Godin and Mayer (1995), "Accuracy
 * estimation of Canadian swath (multibeam) and sweep (multitransducer) sounding systems", Canadian
 * Hydrographic Service. Each contributes a one-sigma vertical part and a one-sigma horizontal part
 * (along-track and across-track); docs/science/uncertainty.md gives every formula.
 * Codes are the ordinals: append new components, never reorder.
 */
public enum TpuComponent {
    SOUNDER("Echo sounder range"),
    SOUND_SPEED_TRANSDUCER("Sound speed at the transducer"),
    SOUND_SPEED_PROFILE("Sound speed through the profile"),
    DRAFT("Draft"),
    SETTLEMENT("Settlement and squat"),
    HEAVE("Heave"),
    WATER_LEVEL("Water level at the gauge"),
    TIDE_ZONE("Tide zoning"),
    ROLL("Roll"),
    PITCH("Pitch"),
    HEADING("Heading"),
    POSITION("Positioning"),
    LATENCY("Latency"),
    LEVER_ARM("Lever arms"),
    FOOTPRINT("Beam footprint");

    private final String label;

    TpuComponent(String label) { this.label = label; }

    /** Name for the report, in the trade's words. */
    public String label() { return label; }

    /** Number of components (array length of a breakdown). */
    public static final int COUNT = values().length;
}
