package org.evanesce.io.sweep;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.evanesce.io.casefile.model.SweepSpec;

/**
 * {@code sweep.json}: what a sweep folder holds, so that a later run of the same sweep can tell
 * whether the case (or the sweep) changed. It holds no times or machine details, so every run and
 * shard of one sweep writes the same bytes.
 */
public final class SweepRecord {

    public static final String SCHEMA = "evanesce-sweep-1";

    private SweepRecord() {
    }

    /** One point as recorded: its overrides (swept values, in the sweep's order) and its hash. */
    public record Entry(SweepPoint point, String hash) { }

    /**
     * The record.
     *
     * @param caseFile   the case file (absolute)
     * @param caseSha256 the SHA-256 of its text
     * @param set        the command line's {@code --set} overrides, applied to every point
     */
    public static Map<String, Object> of(String version, String caseFile, String caseSha256, Map<String, String> set,
                                         SweepSpec sweep, List<Entry> points) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("program", "evanesce");
        m.put("schema", SCHEMA);
        m.put("version", version);
        m.put("case_file", caseFile);
        m.put("case_sha256", caseSha256);
        m.put("set", new LinkedHashMap<>(set));
        m.put("combine", sweep.combine().caseName());
        List<Object> params = new ArrayList<>();
        for (SweepSpec.Axis a : sweep.parameters()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("name", a.name());
            e.put("kind", a.kind().describe());
            e.put("definition", a.definition());
            e.put("values", a.values());
            params.add(e);
        }
        m.put("parameters", params);
        List<Object> pts = new ArrayList<>();
        for (Entry p : points) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("point", p.point().number());
            e.put("folder", p.point().folderName());
            e.put("values", p.point().overrides());
            e.put("point_hash", p.hash());
            pts.add(e);
        }
        m.put("points", pts);
        return m;
    }

    /**
     * What differs between the sweep recorded in a folder and the one asked for now, in words;
     * empty when they are the same sweep. The case file's path may differ (a moved folder): only
     * its content counts.
     */
    public static List<String> differences(Object recorded, Map<String, Object> now) {
        List<String> out = new ArrayList<>();
        if (!(recorded instanceof Map<?, ?> old) || !SCHEMA.equals(old.get("schema"))) {
            out.add("it is not a sweep record of this program (schema " + SCHEMA + ")");
            return out;
        }
        Map<String, String> before = definitions(old.get("parameters"));
        Map<String, String> after = definitions(now.get("parameters"));
        for (Map.Entry<String, String> e : before.entrySet()) {
            if (!after.containsKey(e.getKey())) {
                out.add("parameter " + e.getKey() + " is no longer swept (it was " + e.getValue() + ")");
            } else if (!after.get(e.getKey()).equals(e.getValue())) {
                out.add("parameter " + e.getKey() + " was " + e.getValue() + ", now " + after.get(e.getKey()));
            }
        }
        for (Map.Entry<String, String> e : after.entrySet()) {
            if (!before.containsKey(e.getKey())) {
                out.add("parameter " + e.getKey() + " is newly swept (" + e.getValue() + ")");
            }
        }
        if (out.isEmpty() && !new ArrayList<>(before.keySet()).equals(new ArrayList<>(after.keySet()))) {
            out.add("the swept parameters' order changed from " + String.join(", ", before.keySet()) + " to "
                    + String.join(", ", after.keySet()));
        }
        if (!Objects.equals(old.get("combine"), now.get("combine"))) {
            out.add("combine was " + old.get("combine") + ", now " + now.get("combine"));
        }
        boolean sweepChanged = !out.isEmpty();
        if (!Objects.equals(old.get("case_sha256"), now.get("case_sha256")) && !sweepChanged) {
            out.add("the case file changed outside its sweep section (SHA-256 " + shortHash(old.get("case_sha256")) + " then, "
                    + shortHash(now.get("case_sha256")) + " now)");
        }
        if (!Objects.equals(text(old.get("set")), text(now.get("set")))) {
            out.add("the --set overrides were " + text(old.get("set")) + ", now " + text(now.get("set")));
        }
        if (!Objects.equals(old.get("version"), now.get("version"))) {
            out.add("it was made by evanesce " + old.get("version") + ", this is " + now.get("version"));
        }
        return out;
    }

    private static Map<String, String> definitions(Object params) {
        Map<String, String> out = new LinkedHashMap<>();
        if (params instanceof List<?> l) {
            for (Object o : l) {
                if (o instanceof Map<?, ?> m) {
                    out.put(String.valueOf(m.get("name")), String.valueOf(m.get("definition")));
                }
            }
        }
        return out;
    }

    private static String text(Object set) {
        if (!(set instanceof Map<?, ?> m) || m.isEmpty()) {
            return "none";
        }
        List<String> parts = new ArrayList<>();
        m.forEach((k, v) -> parts.add(k + "=" + v));
        return String.join(", ", parts);
    }

    private static String shortHash(Object h) {
        String s = String.valueOf(h);
        return s.length() > 12 ? s.substring(0, 12) + "..." : s;
    }
}
