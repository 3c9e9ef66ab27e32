package org.evanesce.io.casefile.text;

import java.util.ArrayDeque;
import java.util.Deque;
import java.util.HashSet;
import java.util.Set;
import org.snakeyaml.engine.v2.api.LoadSettings;
import org.snakeyaml.engine.v2.api.lowlevel.Parse;
import org.snakeyaml.engine.v2.common.Anchor;
import org.snakeyaml.engine.v2.events.AliasEvent;
import org.snakeyaml.engine.v2.events.CollectionStartEvent;
import org.snakeyaml.engine.v2.events.Event;
import org.snakeyaml.engine.v2.exceptions.Mark;

/**
 * Limits on the shape of a case file's YAML, checked on the parser's events before the file is
 * composed into nodes: the composer (and the reader after it) recurse once per level of nesting, so
 * nesting is measured here first, with a stack of its own. The limits are far above what a case
 * needs (its deepest value, a polygon's corner, is six levels down).
 *
 * <ul>
 *   <li>at most {@value #MAX_DEPTH} levels of lists and mappings inside each other;</li>
 *   <li>at most {@value #MAX_COLLECTION_ALIASES} aliases ({@code *name}) of lists or mappings, so that
 *       nested aliases cannot multiply the work (the "billion laughs" file);</li>
 *   <li>no alias of a list or mapping inside itself.</li>
 * </ul>
 */
public final class YamlLimits {

    /** The deepest nesting of lists and mappings accepted. */
    public static final int MAX_DEPTH = 32;
    /** The most aliases of lists or mappings accepted in one file. */
    public static final int MAX_COLLECTION_ALIASES = 50;

    private YamlLimits() {
    }

    /**
     * The first limit the text breaks, as an error at its place, or null when it keeps them all.
     * Syntax errors are thrown as the parser's exceptions, as when composing.
     */
    public static Diagnostic check(LoadSettings settings, String text, String source) {
        Deque<Object> open = new ArrayDeque<>();
        Set<Anchor> collections = new HashSet<>();
        int depth = 0;
        int aliases = 0;
        for (Event e : new Parse(settings).parseString(text)) {
            switch (e.getEventId()) {
                case MappingStart, SequenceStart -> {
                    depth++;
                    if (depth > MAX_DEPTH) {
                        return error(source, e, "lists and mappings nest more than " + MAX_DEPTH + " levels deep here, the limit; "
                                + "a case file needs at most six");
                    }
                    Anchor a = ((CollectionStartEvent) e).getAnchor().orElse(null);
                    if (a != null) {
                        collections.add(a);
                    }
                    open.push(a == null ? Boolean.FALSE : a);
                }
                case MappingEnd, SequenceEnd -> {
                    depth--;
                    open.pop();
                }
                case Alias -> {
                    Anchor a = ((AliasEvent) e).getAlias();
                    if (open.contains(a)) {
                        return error(source, e, "the alias *" + a.getValue() + " refers to the list or mapping that holds it; "
                                + "a case file cannot contain itself");
                    }
                    if (collections.contains(a) && ++aliases > MAX_COLLECTION_ALIASES) {
                        return error(source, e, "more than " + MAX_COLLECTION_ALIASES + " aliases of lists or mappings, the limit; "
                                + "write the values out or use parameters");
                    }
                }
                default -> {
                    // scalars, documents and the stream carry no nesting
                }
            }
        }
        return null;
    }

    private static Diagnostic error(String source, Event e, String message) {
        Mark m = e.getStartMark().orElse(null);
        SourcePosition at = m == null ? new SourcePosition(source, 1, 1) : new SourcePosition(source, m.getLine() + 1, m.getColumn() + 1);
        return new Diagnostic(Diagnostic.Severity.ERROR, at, "", message);
    }
}
