package org.leadline.io;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Writes {@code lineage.json}: the inputs of a run with their SHA-256 (FIPS 180-4), every
 * setting, the program version, start and end times, and the outputs. Plain JSON (RFC 8259)
 * through Jackson.
 */
public final class LineageWriter {
    private LineageWriter() {}

    /** One input file and its role. */
    public record Input(String role, Path path, String sha256, long bytes) {}

    /** SHA-256 of a file as lower-case hex. */
    public static String sha256(Path file) throws IOException {
        MessageDigest md;
        try {
            md = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 missing from this Java runtime", e);
        }
        try (InputStream in = Files.newInputStream(file)) {
            byte[] buf = new byte[1 << 16];
            for (int k; (k = in.read(buf)) > 0; ) md.update(buf, 0, k);
        }
        return HexFormat.of().formatHex(md.digest());
    }

    /** Describes an input file (hashing it). */
    public static Input input(String role, Path path) throws IOException {
        return new Input(role, path, sha256(path), Files.size(path));
    }

    /**
     * Writes the lineage document to {@code out}.
     *
     * @param settings every setting of the run, in order
     * @param outputs  output file name to "produced" or a note such as "not produced: ..."
     */
    public static void write(Path out, String version, String start, String end, List<Input> inputs,
                             Map<String, Object> settings, Map<String, String> outputs,
                             List<String> warnings) throws IOException {
        Map<String, Object> doc = new LinkedHashMap<>();
        doc.put("program", "Leadline");
        doc.put("version", version);
        doc.put("started", start);
        doc.put("finished", end);
        List<Map<String, Object>> in = inputs.stream().map(i -> {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("role", i.role());
            m.put("path", i.path().toString());
            m.put("sha256", i.sha256());
            m.put("bytes", i.bytes());
            return m;
        }).toList();
        doc.put("inputs", in);
        doc.put("settings", settings);
        doc.put("outputs", outputs);
        doc.put("warnings", warnings);
        doc.put("caution", "Not for navigation unless validated by a qualified hydrographer; local regulations, "
                + "the charting authority and licensed practice prevail.");
        new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT).writeValue(out.toFile(), doc);
    }
}
