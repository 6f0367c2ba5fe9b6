package org.leadline.survey;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;


/**
 * One survey project: the input files and the processing settings (docs/formats/project.md).
 * Paths are absolute and normalised (a project file's relative names are resolved against its
 * folder by {@link org.leadline.io.ProjectReader}); an input that is not given is null (single
 * files) or an empty list. Command-line overrides go through {@link #toBuilder()}:
 * <pre>{@code
 * Project p = ProjectReader.read(file).toBuilder().cell(2.0).soundings(List.of(extra)).build();
 * }</pre>
 *
 * @param folder     folder of the project file (or the working folder when there is none)
 * @param name       project name for the report ("" when not given)
 * @param soundings  ping CSV files
 * @param nmea       NMEA 0183 logs
 * @param navigation separate navigation CSV, or null
 * @param attitude   separate attitude CSV, or null
 * @param casts      cast CSV files
 * @param tide       water-level (reference gauge) CSV, or null
 * @param tideZones  tide zones GeoJSON, or null
 * @param vessel     vessel YAML, or null
 * @param journal    edit journal, or null (may not exist yet)
 * @param settings   processing settings
 */
public record Project(Path folder, String name, List<Path> soundings, List<Path> nmea, Path navigation, Path attitude,
                      List<Path> casts, Path tide, Path tideZones, Path vessel, Path journal, Settings settings) {

    /** Sound-speed equations (DESIGN.md section 5). */
    public static final List<String> EQUATIONS = List.of("unesco", "del-grosso", "mackenzie", "coppens");
    /** Gridding methods. */
    public static final List<String> SURFACES = List.of("median", "mean", "shoalest", "weighted", "cube");
    /** IHO S-44 orders. */
    public static final List<String> ORDERS = List.of("exclusive", "special", "1a", "1b", "2");
    /** How a ping picks its cast. */
    public static final List<String> CAST_SELECTIONS = List.of("nearest-time", "nearest-distance", "interpolate-time");

    public Project {
        Objects.requireNonNull(folder, "folder");
        name = name == null ? "" : name;
        soundings = List.copyOf(soundings);
        nmea = List.copyOf(nmea);
        casts = List.copyOf(casts);
        Objects.requireNonNull(settings, "settings");
    }

    public Builder toBuilder() { return new Builder(this); }

    /** An empty project in a folder (no inputs, default settings). */
    public static Builder builder(Path folder) {
        return new Builder(new Project(folder.toAbsolutePath().normalize(), "", List.of(), List.of(), null, null,
                List.of(), null, null, null, null, Settings.DEFAULT));
    }

    /**
     * Processing settings. NaN means "not set" for the numbers that have no default.
     *
     * @param equation      sound-speed equation, one of {@link #EQUATIONS}
     * @param cell          grid cell size, m (> 0)
     * @param crs           "auto" (UTM zone of the survey) or "EPSG:n"
     * @param surface       gridding method, one of {@link #SURFACES}
     * @param order         IHO S-44 order to test against, one of {@link #ORDERS}
     * @param castSelection one of {@link #CAST_SELECTIONS}
     * @param latitude      latitude for pressure/depth conversions of casts, degrees; NaN: from the casts or pings
     * @param sounderSpeed  override of the vessel's sounder set speed, m/s; NaN: use the vessel file
     * @param draft         override of the vessel's static draft, m; NaN: use the vessel file
     * @param cleaning      free settings of the cleaning filters, passed through unread (unmodifiable)
     * @param crosslines    names of the survey lines run as crosslines (compared with the main scheme)
     */
    public record Settings(String equation, double cell, String crs, String surface, String order, String castSelection,
                           double latitude, double sounderSpeed, double draft, Map<String, Object> cleaning,
                           List<String> crosslines) {
        public static final Settings DEFAULT = new Settings("unesco", Double.NaN, "auto", "median", "1a", "nearest-time",
                Double.NaN, Double.NaN, Double.NaN, Map.of(), List.of());

        public Settings {
            check(EQUATIONS, equation, "equation");
            check(SURFACES, surface, "surface");
            check(ORDERS, order, "order");
            check(CAST_SELECTIONS, castSelection, "cast_selection");
            String crsProblem = crsProblem(crs);
            if (crsProblem != null) throw new IllegalArgumentException(crsProblem);
            if (!Double.isNaN(cell) && (!(cell > 0) || !Double.isFinite(cell))) {
                throw new IllegalArgumentException("expected a cell size > 0 m (or none for the suggested size), found " + cell);
            }
            if (!Double.isNaN(latitude) && !(Math.abs(latitude) <= 90)) {
                throw new IllegalArgumentException("expected a latitude in [-90, 90] degrees, found " + latitude);
            }
            if (!Double.isNaN(sounderSpeed) && !(sounderSpeed >= 1300 && sounderSpeed <= 1800)) {
                throw new IllegalArgumentException("expected a sounder speed in [1300, 1800] m/s, found " + sounderSpeed);
            }
            if (!Double.isNaN(draft) && !(draft >= 0 && draft <= 30)) {
                throw new IllegalArgumentException("expected a draft in [0, 30] m, found " + draft);
            }
            cleaning = cleaning == null ? Map.of() : Collections.unmodifiableMap(new LinkedHashMap<>(cleaning));
            crosslines = crosslines == null ? List.of() : List.copyOf(crosslines);
        }

        private static void check(List<String> allowed, String value, String what) {
            if (!allowed.contains(value)) {
                throw new IllegalArgumentException("expected " + what + " one of " + String.join(", ", allowed) + ", found '" + value + "'");
            }
        }

        /** Null when the text is a valid CRS setting, else what is wrong with it. */
        public static String crsProblem(String crs) {
            if (crs != null && (crs.equals("auto") || crs.matches("(?i)EPSG:[1-9][0-9]{0,8}"))) return null;
            return "expected crs 'auto' or 'EPSG:<code>', found '" + crs + "'";
        }
    }

    /** Copy-and-change builder; {@link #build()} validates like the constructors do. */
    public static final class Builder {
        private Path folder;
        private String name;
        private List<Path> soundings, nmea, casts;
        private Path navigation, attitude, tide, tideZones, vessel, journal;
        private String equation, crs, surface, order, castSelection;
        private double cell, latitude, sounderSpeed, draft;
        private Map<String, Object> cleaning;
        private List<String> crosslines;

        private Builder(Project p) {
            folder = p.folder; name = p.name; soundings = new ArrayList<>(p.soundings); nmea = new ArrayList<>(p.nmea);
            casts = new ArrayList<>(p.casts); navigation = p.navigation; attitude = p.attitude; tide = p.tide;
            tideZones = p.tideZones; vessel = p.vessel; journal = p.journal;
            Settings s = p.settings;
            equation = s.equation; crs = s.crs; surface = s.surface; order = s.order; castSelection = s.castSelection;
            cell = s.cell; latitude = s.latitude; sounderSpeed = s.sounderSpeed; draft = s.draft; cleaning = s.cleaning;
            crosslines = s.crosslines;
        }

        private static Path abs(Path p) { return p == null ? null : p.toAbsolutePath().normalize(); }
        private static List<Path> abs(List<Path> ps) { return ps.stream().map(Builder::abs).toList(); }

        public Builder name(String v) { name = v; return this; }
        /** Replaces the ping files. */
        public Builder soundings(List<Path> v) { soundings = new ArrayList<>(abs(v)); return this; }
        public Builder nmea(List<Path> v) { nmea = new ArrayList<>(abs(v)); return this; }
        public Builder casts(List<Path> v) { casts = new ArrayList<>(abs(v)); return this; }
        public Builder navigation(Path v) { navigation = abs(v); return this; }
        public Builder attitude(Path v) { attitude = abs(v); return this; }
        public Builder tide(Path v) { tide = abs(v); return this; }
        public Builder tideZones(Path v) { tideZones = abs(v); return this; }
        public Builder vessel(Path v) { vessel = abs(v); return this; }
        public Builder journal(Path v) { journal = abs(v); return this; }
        public Builder equation(String v) { equation = v; return this; }
        public Builder cell(double v) { cell = v; return this; }
        public Builder crs(String v) { crs = v; return this; }
        public Builder surface(String v) { surface = v; return this; }
        public Builder order(String v) { order = v; return this; }
        public Builder castSelection(String v) { castSelection = v; return this; }
        public Builder latitude(double v) { latitude = v; return this; }
        public Builder sounderSpeed(double v) { sounderSpeed = v; return this; }
        public Builder draft(double v) { draft = v; return this; }
        public Builder cleaning(Map<String, Object> v) { cleaning = v; return this; }
        public Builder crosslines(List<String> v) { crosslines = v; return this; }

        /** @throws IllegalArgumentException when a setting is out of its allowed values */
        public Project build() {
            return new Project(folder, name, soundings, nmea, navigation, attitude, casts, tide, tideZones, vessel, journal,
                    new Settings(equation, cell, crs, surface, order, castSelection, latitude, sounderSpeed, draft, cleaning, crosslines));
        }
    }

    /** All input files that are given, in a stable order (for lineage). */
    public List<Path> inputs() {
        List<Path> all = new ArrayList<>(soundings);
        all.addAll(nmea);
        for (Path p : new Path[] {navigation, attitude}) if (p != null) all.add(p);
        all.addAll(casts);
        for (Path p : new Path[] {tide, tideZones, vessel, journal}) if (p != null) all.add(p);
        return all;
    }

}
