package org.evanesce.io.casefile.expr;

import java.util.Collection;
import java.util.Locale;
import java.util.Optional;

/** "Did you mean" suggestions: the closest candidate by edit distance, if it is close enough. */
public final class Suggest {

    private Suggest() {
    }

    /**
     * The candidate closest to {@code word}, counting insertions, deletions, substitutions and swaps
     * of neighbouring letters, ignoring case; only if the distance is at most 1 for words of up to
     * 4 letters, 2 up to 8 letters and 3 beyond.
     */
    public static Optional<String> closest(String word, Collection<String> candidates) {
        String w = word.toLowerCase(Locale.ROOT);
        String best = null;
        int bestDistance = Integer.MAX_VALUE;
        for (String c : candidates) {
            int d = distance(w, c.toLowerCase(Locale.ROOT));
            if (d < bestDistance) {
                best = c;
                bestDistance = d;
            }
        }
        int limit = w.length() <= 4 ? 1 : w.length() <= 8 ? 2 : 3;
        // a suggestion that shares nothing with the word (e.g. 's' for 'q') is noise
        boolean related = best != null && bestDistance < Math.max(w.length(), best.length());
        return related && bestDistance <= limit && !best.equals(word) ? Optional.of(best) : Optional.empty();
    }

    /** Text for a message: itself up to 60 characters, else its start and its length. */
    public static String shown(String text) {
        return text.length() <= 60 ? text : text.substring(0, 50) + "... (" + text.length() + " characters)";
    }

    /** " (did you mean 'x'?)" or the empty string. */
    public static String didYouMean(String word, Collection<String> candidates) {
        return closest(word, candidates).map(s -> " (did you mean '" + s + "'?)").orElse("");
    }

    /** Optimal-string-alignment distance (Damerau–Levenshtein without repeated edits of a substring). */
    static int distance(String a, String b) {
        int[][] d = new int[a.length() + 1][b.length() + 1];
        for (int i = 0; i <= a.length(); i++) {
            d[i][0] = i;
        }
        for (int j = 0; j <= b.length(); j++) {
            d[0][j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            for (int j = 1; j <= b.length(); j++) {
                int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                int v = Math.min(Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1), d[i - 1][j - 1] + cost);
                if (i > 1 && j > 1 && a.charAt(i - 1) == b.charAt(j - 2) && a.charAt(i - 2) == b.charAt(j - 1)) {
                    v = Math.min(v, d[i - 2][j - 2] + 1);
                }
                d[i][j] = v;
            }
        }
        return d[a.length()][b.length()];
    }
}
