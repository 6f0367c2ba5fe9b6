package org.leadline.io;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;
import org.yaml.snakeyaml.nodes.Tag;

/**
 * Strict reading of Leadline's YAML files through SnakeYAML's node graph, which keeps the
 * position of every key and value: errors name the file, the 1-based line and the 1-based
 * character column of the offending node. Unknown and repeated keys are errors, so that a typo
 * ({@code draft: 0.5} for {@code draft_m}) is never silently ignored.
 */
final class YamlInput {
    final Path file;

    /** Largest YAML file read, bytes: vessel and project files are a few kilobytes. */
    static final long MAX_BYTES = 1L << 20;

    YamlInput(Path file) { this.file = file; }

    /** The document's top-level mapping. */
    MappingNode load() {
        Node root;
        // Size, text and UTF-8 checks first: SnakeYAML takes minutes over a 10 MB scalar before its
        // own code-point limit trips, and reports a binary file as a decoder exception.
        String text = TextFiles.read(file, MAX_BYTES, "a YAML file");
        try (Reader r = new java.io.StringReader(text)) {
            LoaderOptions opts = new LoaderOptions();
            opts.setAllowRecursiveKeys(false);
            opts.setMaxAliasesForCollections(10);
            root = new Yaml(opts).compose(r);
        } catch (NoSuchFileException e) {
            throw new InputException(file, "file not found");
        } catch (MarkedYAMLException e) {
            var m = e.getProblemMark();
            throw new InputException(file.toString(), m == null ? 0 : m.getLine() + 1, m == null ? 0 : m.getColumn() + 1,
                    "not valid YAML: " + e.getProblem(), e);
        } catch (YAMLException | IOException e) {
            throw new InputException(file.toString(), 0, 0, "cannot read YAML: " + e.getMessage(), e);
        }
        if (root == null) throw new InputException(file, "expected a YAML mapping, found an empty file");
        if (!(root instanceof MappingNode m)) throw error(root, "expected a mapping of keys at the top level");
        return m;
    }

    InputException error(Node n, String problem) {
        var mark = n.getStartMark();
        return new InputException(file, mark == null ? 0 : mark.getLine() + 1, mark == null ? 0 : mark.getColumn() + 1, problem);
    }

    /**
     * The entries of a mapping by key, checking that every key is a known one and none repeats.
     *
     * @param where  name of the section for messages ("top level", "sounder")
     */
    Map<String, Node> entries(MappingNode m, String where, Set<String> allowed) {
        Map<String, Node> out = new LinkedHashMap<>();
        for (NodeTuple t : m.getValue()) {
            Node k = t.getKeyNode();
            if (!(k instanceof ScalarNode ks)) throw error(k, "expected a plain key in " + where);
            String key = ks.getValue();
            if (!allowed.contains(key)) {
                throw error(k, "unknown key '" + key + "' in " + where + "; expected one of " + String.join(", ", new java.util.TreeSet<>(allowed)));
            }
            if (out.put(key, t.getValueNode()) != null) throw error(k, "key '" + key + "' appears twice in " + where);
        }
        return out;
    }

    static boolean isNull(Node n) { return n == null || (n instanceof ScalarNode && Tag.NULL.equals(n.getTag())); }

    MappingNode mapping(Node n, String key) {
        if (n instanceof MappingNode m) return m;
        throw error(n, "expected a mapping under '" + key + "', found " + describe(n));
    }

    List<Node> sequence(Node n, String key) {
        if (n instanceof SequenceNode s) return s.getValue();
        throw error(n, "expected a list under '" + key + "', found " + describe(n));
    }

    String string(Node n, String key) {
        if (n instanceof ScalarNode s && !Tag.NULL.equals(s.getTag())) return s.getValue();
        throw error(n, "expected a text value for '" + key + "', found " + describe(n));
    }

    /** A finite number (YAML int or float; also 1e3-style plain scalars, which YAML 1.1 types as text). */
    double number(Node n, String key) {
        if (n instanceof ScalarNode s && !Tag.NULL.equals(s.getTag()) && !Tag.BOOL.equals(s.getTag())) {
            String v = s.getValue().replace("_", "");
            try {
                double d = Double.parseDouble(v);
                if (Double.isFinite(d)) return d;
            } catch (NumberFormatException e) {
                // fall through to the error
            }
            throw error(n, "expected a finite number for '" + key + "', found '" + TextFiles.abbreviate(s.getValue()) + "'");
        }
        throw error(n, "expected a number for '" + key + "', found " + describe(n));
    }

    /** A number within [lo, hi]. */
    double number(Node n, String key, double lo, double hi, String unit) {
        double d = number(n, key);
        if (d < lo || d > hi) throw error(n, "expected '" + key + "' in [" + fmt(lo) + ", " + fmt(hi) + "] " + unit + ", found " + fmt(d));
        return d;
    }

    private static String fmt(double d) { return d == Math.rint(d) && Math.abs(d) < 1e15 ? Long.toString((long) d) : Double.toString(d); }

    static String describe(Node n) {
        if (n instanceof ScalarNode s) return Tag.NULL.equals(s.getTag()) ? "nothing" : "'" + TextFiles.abbreviate(s.getValue()) + "'";
        if (n instanceof SequenceNode) return "a list";
        if (n instanceof MappingNode) return "a mapping";
        return "something else";
    }

    /** A node turned into plain Java values: Map (ordered), List, String, Long, Double, Boolean or null. */
    Object plain(Node n) {
        if (n instanceof MappingNode m) {
            Map<String, Object> out = new LinkedHashMap<>();
            for (NodeTuple t : m.getValue()) {
                if (!(t.getKeyNode() instanceof ScalarNode k)) throw error(t.getKeyNode(), "expected a plain key");
                if (out.containsKey(k.getValue())) throw error(k, "key '" + k.getValue() + "' appears twice");
                out.put(k.getValue(), plain(t.getValueNode()));
            }
            return out;
        }
        if (n instanceof SequenceNode s) {
            List<Object> out = new ArrayList<>();
            for (Node c : s.getValue()) out.add(plain(c));
            return out;
        }
        ScalarNode s = (ScalarNode) n;
        Tag tag = s.getTag();
        String v = s.getValue();
        try {
            if (Tag.NULL.equals(tag)) return null;
            if (Tag.BOOL.equals(tag)) return v.equalsIgnoreCase("true") || v.equalsIgnoreCase("yes") || v.equalsIgnoreCase("on") || v.equalsIgnoreCase("y");
            if (Tag.INT.equals(tag)) return Long.decode(v.replace("_", ""));
            if (Tag.FLOAT.equals(tag)) return Double.parseDouble(v.replace("_", ""));
        } catch (NumberFormatException e) {
            throw error(n, "cannot read the number '" + v + "'");
        }
        return v;
    }
}
