package org.leadline.io;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.leadline.survey.Project;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.ScalarNode;

/**
 * Reads a project file (docs/formats/project.md): a YAML mapping with an {@code inputs} section
 * naming the files, relative to the project file's folder, and a {@code settings} section.
 *
 * <p>Names in a project file must stay inside the project folder: an absolute path, a drive
 * letter or a {@code ..} element is refused, so that a project copied or shared as a folder
 * cannot reach other files. Every named input except the edit journal must exist. Unknown keys,
 * wrong types and values outside their allowed set are {@link InputException}s naming the file,
 * line and character column.
 */
public final class ProjectReader {
    private ProjectReader() {}

    static final Set<String> TOP = Set.of("name", "inputs", "settings");
    static final Set<String> INPUTS = Set.of("soundings", "nmea", "navigation", "attitude", "casts", "tide",
            "tide_zones", "vessel", "journal");
    static final Set<String> SETTINGS = Set.of("equation", "cell_m", "crs", "surface", "order", "cast_selection",
            "latitude_deg", "sounder_speed_m_s", "draft_m", "cleaning", "crosslines");

    public static Project read(Path file) {
        YamlInput y = new YamlInput(file);
        MappingNode root = y.load();
        Path folder = file.toAbsolutePath().normalize().getParent();
        Map<String, Node> top = y.entries(root, "the project file", TOP);
        Project.Builder b = Project.builder(folder);
        if (!YamlInput.isNull(top.get("name"))) b.name(y.string(top.get("name"), "name"));

        Node in = top.get("inputs");
        if (!YamlInput.isNull(in)) {
            Map<String, Node> m = y.entries(y.mapping(in, "inputs"), "inputs", INPUTS);
            b.soundings(list(y, folder, m.get("soundings"), "soundings"));
            b.nmea(list(y, folder, m.get("nmea"), "nmea"));
            b.casts(list(y, folder, m.get("casts"), "casts"));
            b.navigation(one(y, folder, m.get("navigation"), "navigation", true));
            b.attitude(one(y, folder, m.get("attitude"), "attitude", true));
            b.tide(one(y, folder, m.get("tide"), "tide", true));
            b.tideZones(one(y, folder, m.get("tide_zones"), "tide_zones", true));
            b.vessel(one(y, folder, m.get("vessel"), "vessel", true));
            b.journal(one(y, folder, m.get("journal"), "journal", false));
        }

        Node st = top.get("settings");
        if (!YamlInput.isNull(st)) {
            Map<String, Node> s = y.entries(y.mapping(st, "settings"), "settings", SETTINGS);
            if (has(s, "equation")) b.equation(choice(y, s.get("equation"), "equation", Project.EQUATIONS));
            if (has(s, "surface")) b.surface(choice(y, s.get("surface"), "surface", Project.SURFACES));
            if (has(s, "order")) b.order(choice(y, s.get("order"), "order", Project.ORDERS));
            if (has(s, "cast_selection")) b.castSelection(choice(y, s.get("cast_selection"), "cast_selection", Project.CAST_SELECTIONS));
            if (has(s, "crs")) {
                String crs = y.string(s.get("crs"), "crs");
                crs = crs.equalsIgnoreCase("auto") ? "auto" : crs.toUpperCase(Locale.ROOT);
                String problem = Project.Settings.crsProblem(crs);
                if (problem != null) throw y.error(s.get("crs"), problem);
                b.crs(crs);
            }
            if (has(s, "cell_m")) {
                double cell = y.number(s.get("cell_m"), "cell_m", 0, 1e5, "m");
                if (cell == 0) throw y.error(s.get("cell_m"), "expected 'cell_m' > 0, found 0");
                b.cell(cell);
            }
            if (has(s, "latitude_deg")) b.latitude(y.number(s.get("latitude_deg"), "latitude_deg", -90, 90, "degrees"));
            if (has(s, "sounder_speed_m_s")) b.sounderSpeed(y.number(s.get("sounder_speed_m_s"), "sounder_speed_m_s", 1300, 1800, "m/s"));
            if (has(s, "draft_m")) b.draft(y.number(s.get("draft_m"), "draft_m", 0, 30, "m"));
            if (has(s, "crosslines")) {
                Node cl = s.get("crosslines");
                if (!(cl instanceof org.yaml.snakeyaml.nodes.SequenceNode seq)) {
                    throw y.error(cl, "expected 'crosslines' a list of line names");
                }
                List<String> names = new java.util.ArrayList<>();
                for (Node item : seq.getValue()) names.add(y.string(item, "crosslines"));
                b.crosslines(names);
            }
            if (has(s, "cleaning")) {
                @SuppressWarnings("unchecked")
                Map<String, Object> c = (Map<String, Object>) y.plain(y.mapping(s.get("cleaning"), "cleaning"));
                b.cleaning(c);
            }
        }
        try {
            return b.build();
        } catch (IllegalArgumentException e) {
            throw new InputException(file, e.getMessage()); // all settings were checked above; kept as a safety net
        }
    }

    private static boolean has(Map<String, Node> m, String key) { return !YamlInput.isNull(m.get(key)); }

    private static String choice(YamlInput y, Node n, String key, List<String> allowed) {
        String v = y.string(n, key).toLowerCase(Locale.ROOT);
        if (!allowed.contains(v)) {
            throw y.error(n, "expected '" + key + "' one of " + String.join(", ", allowed) + ", found '" + y.string(n, key) + "'");
        }
        return v;
    }

    private static List<Path> list(YamlInput y, Path folder, Node n, String key) {
        List<Path> out = new ArrayList<>();
        if (YamlInput.isNull(n)) return out;
        if (n instanceof ScalarNode) { // a single name is accepted where a list is expected
            out.add(one(y, folder, n, key, true));
            return out;
        }
        for (Node e : y.sequence(n, key)) out.add(one(y, folder, e, key, true));
        return out;
    }

    private static Path one(YamlInput y, Path folder, Node n, String key, boolean mustExist) {
        if (YamlInput.isNull(n)) return null;
        String name = y.string(n, key);
        String problem = unsafe(name);
        if (problem != null) throw y.error(n, "'" + key + "': " + problem);
        Path p = folder.resolve(name).normalize();
        if (mustExist && !Files.isRegularFile(p)) {
            throw y.error(n, "'" + key + "': expected an existing file, found no file " + name + " in " + folder);
        }
        return p;
    }

    /**
     * Null when a name from a project file is a safe relative path inside the project folder;
     * otherwise what is wrong with it.
     */
    public static String unsafe(String name) {
        if (name.isBlank()) return "expected a file name relative to the project folder, found an empty name";
        if (name.indexOf('\0') >= 0) return "a file name must not contain a NUL character";
        if (name.startsWith("/") || name.startsWith("\\") || name.matches("^[A-Za-z]:.*") || name.startsWith("~")) {
            return "expected a path relative to the project folder, found the absolute path '" + name + "'";
        }
        for (String part : name.split("[/\\\\]")) {
            if (part.equals("..")) return "expected a path inside the project folder, found '..' in '" + name + "'";
        }
        if (Path.of(name).isAbsolute()) return "expected a path relative to the project folder, found the absolute path '" + name + "'";
        return null;
    }
}
