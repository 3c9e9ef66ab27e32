package org.evanesce.io.casefile.sections;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.evanesce.io.casefile.CaseReader;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.casefile.model.LibraryMaterial;
import org.evanesce.io.casefile.text.Diagnostic;
import org.junit.jupiter.api.Test;

/**
 * docs/case-file.md against the reader: the reference tables list exactly the keys the schema
 * accepts, every YAML example on the page reads without errors, and reading the examples asks for
 * every key of the schema (so no key is accepted but ignored).
 */
class CaseFileDocTest {

    private static final Path DOC = Path.of("..", "docs", "case-file.md");
    private static final Pattern HEADING = Pattern.compile("^###\\s+`([^`]+)`\\s*$");
    private static final Pattern ROW = Pattern.compile("^\\|\\s*`([^`]+)`\\s*\\|");

    private static List<String> lines() throws IOException {
        assertTrue(Files.exists(DOC), "the case-file reference is missing: " + DOC.toAbsolutePath());
        return Files.readAllLines(DOC);
    }

    /** Section id → keys, from each "### `id`" heading and the "| key |" table under it. */
    private static Map<String, List<String>> documentedKeys() throws IOException {
        Map<String, List<String>> out = new LinkedHashMap<>();
        String section = null;
        boolean inKeyTable = false;
        for (String line : lines()) {
            Matcher h = HEADING.matcher(line);
            if (line.startsWith("#")) {
                section = h.matches() ? h.group(1) : null;
                inKeyTable = false;
                if (section != null) {
                    assertFalse(out.containsKey(section), "section documented twice: " + section);
                    out.put(section, new ArrayList<>());
                }
                continue;
            }
            if (section == null) {
                continue;
            }
            if (line.startsWith("| key |")) {
                inKeyTable = true;
            } else if (!line.startsWith("|")) {
                inKeyTable = false;
            } else if (inKeyTable) {
                Matcher r = ROW.matcher(line);
                if (r.find()) {
                    out.get(section).add(r.group(1));
                }
            }
        }
        return out;
    }

    private static List<String> yamlExamples() throws IOException {
        List<String> out = new ArrayList<>();
        StringBuilder block = null;
        for (String line : lines()) {
            if (block == null && line.strip().equals("```yaml")) {
                block = new StringBuilder();
            } else if (block != null && line.strip().equals("```")) {
                out.add(block.toString());
                block = null;
            } else if (block != null) {
                block.append(line).append('\n');
            }
        }
        return out;
    }

    @Test
    void everySchemaSectionAndKeyIsDocumentedAndNothingElse() throws IOException {
        Map<String, List<String>> doc = documentedKeys();
        Map<String, List<String>> schema = new LinkedHashMap<>();
        for (Schema.Section s : Schema.ALL) {
            schema.put(s.id(), s.keys());
        }
        assertEquals(schema.keySet(), doc.keySet(), "documented sections differ from the schema's");
        for (String id : schema.keySet()) {
            assertEquals(new TreeSet<>(schema.get(id)), new TreeSet<>(doc.get(id)), "keys of section " + id);
            assertEquals(schema.get(id).size(), doc.get(id).size(), "a key documented twice in section " + id);
        }
    }

    @Test
    void everyExampleReadsAndTogetherTheyExerciseEveryKey() throws IOException {
        List<String> examples = yamlExamples();
        assertTrue(examples.size() >= 3, "expected the complete example and the smaller ones");
        Set<String> consumed = new LinkedHashSet<>();
        for (int k = 0; k < examples.size(); k++) {
            // read as if beside the page, so that an example's table (docs/gold-jc-nk.csv) is found
            CaseReader.Reading r = CaseLoader.reading(examples.get(k), DOC.resolveSibling("example" + k + ".yaml").toString(), Map.of(), new ReadOptions(Long.MAX_VALUE));
            String errors = r.context().diagnostics.stream().filter(Diagnostic::isError).map(Diagnostic::toString)
                    .collect(Collectors.joining("\n"));
            assertNotNull(r.spec(), "example " + k + " of the reference has errors:\n" + errors);
            consumed.addAll(r.context().consumed);
        }
        Set<String> all = new TreeSet<>();
        for (Schema.Section s : Schema.ALL) {
            for (String key : s.keys()) {
                all.add(s.id() + " " + key);
            }
        }
        Set<String> unread = new TreeSet<>(all);
        unread.removeAll(consumed);
        assertEquals(Set.of(), unread, "schema keys the reader never asked for while reading the examples");
        Set<String> unknown = new TreeSet<>(consumed);
        unknown.removeAll(all);
        assertEquals(Set.of(), unknown, "keys read that the schema does not list");
    }

    @Test
    void builtInMaterialsAreListed() throws IOException {
        String text = String.join("\n", lines());
        for (LibraryMaterial m : LibraryMaterial.values()) {
            assertTrue(text.contains("| `" + m.caseName() + "` |"), "built-in material not in the reference: " + m.caseName());
        }
    }
}
