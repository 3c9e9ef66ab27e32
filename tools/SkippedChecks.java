import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import javax.xml.parsers.DocumentBuilderFactory;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

/**
 * Lists, by name, every check that was skipped in the last test run: the tests Maven's surefire
 * reports as skipped (with the reason the test gave, e.g. a tool that is not installed) and the
 * lines that scripts such as tools/slurm-sweep-check.sh appended to target/skipped-checks.txt.
 * Run from the repository root: {@code java tools/SkippedChecks.java}. Prints nothing when none was
 * skipped; always exits 0 (skips are reported, not failures).
 */
public final class SkippedChecks {

    private SkippedChecks() {
    }

    public static void main(String[] args) throws Exception {
        Path root = Path.of(args.length > 0 ? args[0] : ".");
        List<String> skipped = new ArrayList<>();
        List<Path> reports = new ArrayList<>();
        try (Stream<Path> s = Files.walk(root, 4)) {
            s.filter(p -> p.getParent() != null && p.getParent().getFileName() != null
                    && p.getParent().getFileName().toString().equals("surefire-reports")
                    && p.getFileName().toString().startsWith("TEST-") && p.toString().endsWith(".xml")).sorted().forEach(reports::add);
        }
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setExpandEntityReferences(false);
        for (Path report : reports) {
            try {
                NodeList cases = f.newDocumentBuilder().parse(report.toFile()).getElementsByTagName("testcase");
                for (int k = 0; k < cases.getLength(); k++) {
                    Element c = (Element) cases.item(k);
                    NodeList skip = c.getElementsByTagName("skipped");
                    if (skip.getLength() > 0) {
                        String cls = c.getAttribute("classname");
                        Element e = (Element) skip.item(0);
                        String why = e.getAttribute("message");
                        if (why.isEmpty()) {
                            // an assumption that failed: its message is the first line of the text
                            why = e.getTextContent().strip().lines().findFirst().orElse("")
                                    .replaceFirst("^[\\w.$]*TestAbortedException: ", "").replaceFirst("^Assumption failed: ", "");
                        }
                        skipped.add(cls.substring(cls.lastIndexOf('.') + 1) + "." + c.getAttribute("name")
                                + (why.isEmpty() ? "" : ": " + why.replaceAll("\\s+", " ").strip()));
                    }
                }
            } catch (org.xml.sax.SAXException | IOException | javax.xml.parsers.ParserConfigurationException e) {
                skipped.add(report + ": unreadable report (" + e.getMessage() + ")");
            }
        }
        Path scripts = root.resolve("target").resolve("skipped-checks.txt");
        if (Files.isRegularFile(scripts)) {
            for (String line : Files.readAllLines(scripts, StandardCharsets.UTF_8)) {
                if (!line.isBlank()) {
                    skipped.add(line.strip());
                }
            }
        }
        if (!skipped.isEmpty()) {
            System.out.println("skipped checks (" + skipped.size() + "):");
            skipped.forEach(s -> System.out.println("  " + s));
        }
    }
}
