package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * The class labels close to one a user wrote, for the "did you mean" of an unknown class filter. A class
 * is close when the whole label is a typing slip away ("plastc sheet"), or when each written word is
 * (nearly) one of its words: users shorten "plastic sheet" to "plastic" and write "plastics" or "glass".
 */
public final class MaterialClassNames {

    /** The most suggestions offered: more would be a list, not a suggestion. */
    static final int MOST = 5;

    private MaterialClassNames() {
    }

    /** The labels close to {@code written}, whole-label slips first, then labels sharing its words, in library order. */
    public static List<String> near(String written, Collection<String> labels) {
        String w = written.toLowerCase(Locale.ROOT).strip();
        int allowed = Math.max(1, Math.min(3, w.length() / 3));
        Set<String> near = new LinkedHashSet<>();
        for (int d = 1; d <= allowed; d++) {
            for (String label : labels) {
                if (EditDistance.between(w, label, allowed) == d) {
                    near.add(label);
                }
            }
        }
        for (String label : labels) {
            if (!label.equals(w) && sharesEveryWord(w, label)) {
                near.add(label);
            }
        }
        return new ArrayList<>(near).subList(0, Math.min(MOST, near.size()));
    }

    /** A listing of the labels for a message: all of them up to {@code listed}, then "…". */
    public static String listing(List<String> labels, int listed) {
        return labels.size() <= listed ? String.join(", ", labels)
                : String.join(", ", labels.subList(0, listed)) + ", …";
    }

    private static boolean sharesEveryWord(String written, String label) {
        List<String> labelWords = words(label);
        for (String word : words(written)) {
            if (labelWords.stream().noneMatch(l -> close(word, l))) {
                return false;
            }
        }
        return true;
    }

    /** One slip in a word of five letters or fewer, two in a longer one; none in a word of one or two letters. */
    private static boolean close(String word, String labelWord) {
        int allowed = word.length() <= 2 ? 0 : word.length() <= 5 ? 1 : 2;
        return EditDistance.between(word, labelWord, allowed) <= allowed;
    }

    private static List<String> words(String s) {
        return List.of(s.split("[\\s-]+"));
    }
}
