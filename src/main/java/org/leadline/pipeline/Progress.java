package org.leadline.pipeline;

/** Progress of a processing run, reported by stage; implementations must be cheap and thread-safe. */
public interface Progress {
    /** A new stage begins (e.g. "Reading pings"). */
    void stage(String name);

    /** Fraction of the current stage done, 0..1. */
    default void fraction(double done) {}

    /** True when the user asked to stop; the run then ends with {@link Cancelled}. */
    default boolean cancelled() { return false; }

    Progress NONE = name -> {};

    /** Thrown when a run is stopped on request; nothing is left in the output folder. */
    final class Cancelled extends RuntimeException {
        private static final long serialVersionUID = 1L;
        public Cancelled() { super("processing cancelled"); }
    }
}
