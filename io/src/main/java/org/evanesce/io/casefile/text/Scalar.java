package org.evanesce.io.casefile.text;

import org.snakeyaml.engine.v2.common.ScalarStyle;
import org.snakeyaml.engine.v2.nodes.ScalarNode;

/**
 * A scalar's text and where it starts, able to place a character of the text on its line so that
 * a message can point inside an expression. Only scalars written on one line map columns; for the
 * others every place is the scalar's start.
 */
public record Scalar(String text, SourcePosition start, boolean mapsColumns) {

    public static Scalar of(ScalarNode node, SourcePosition at) {
        ScalarStyle style = node.getScalarStyle();
        boolean oneLine = node.getStartMark().isPresent() && node.getEndMark().isPresent()
                && node.getStartMark().get().getLine() == node.getEndMark().get().getLine();
        boolean plain = style == ScalarStyle.PLAIN;
        boolean quoted = style == ScalarStyle.SINGLE_QUOTED || style == ScalarStyle.DOUBLE_QUOTED;
        if (quoted && oneLine) {
            return new Scalar(node.getValue(), at.shifted(1), !node.getValue().contains("\\"));
        }
        return new Scalar(node.getValue(), at, plain && oneLine);
    }

    /** The place of character {@code offset} of the text. */
    public SourcePosition positionAt(int offset) {
        return mapsColumns ? start.shifted(Math.max(0, Math.min(offset, text.length()))) : start;
    }

    /** The text from character {@code from} on, as a scalar of its own. */
    public Scalar from(int from) {
        return new Scalar(text.substring(from), positionAt(from), mapsColumns);
    }
}
