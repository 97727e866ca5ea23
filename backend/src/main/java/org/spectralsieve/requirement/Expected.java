package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * What fits at one place of a requirement text: keywords (quoted in messages, and the pool for "did you
 * mean" suggestions) and descriptions ("a number"), plus an optional context ("after 'blocks'").
 */
record Expected(List<String> keywords, List<String> descriptions, String context) {

    Expected {
        keywords = List.copyOf(keywords);
        descriptions = List.copyOf(descriptions);
        context = context == null ? "" : context;
    }

    static Expected keywords(String... keywords) {
        return new Expected(List.of(keywords), List.of(), "");
    }

    static Expected described(String description) {
        return new Expected(List.of(), List.of(description), "");
    }

    Expected or(String description) {
        List<String> more = new ArrayList<>(descriptions);
        more.add(description);
        return new Expected(keywords, more, context);
    }

    Expected after(String word) {
        return new Expected(keywords, descriptions, "after '" + word + "'");
    }

    Expected because(String why) {
        return new Expected(keywords, descriptions, why);
    }

    /** "'over', 'above' or a number after 'passes'". */
    String describe() {
        List<String> all = new ArrayList<>();
        keywords.forEach(k -> all.add("'" + k + "'"));
        all.addAll(descriptions);
        String list = all.size() == 1 ? all.get(0)
                : String.join(", ", all.subList(0, all.size() - 1)) + " or " + all.get(all.size() - 1);
        return context.isEmpty() ? list : list + " " + context;
    }

    /**
     * The keyword closest to {@code word} by edit distance, if it is close enough to be a typing slip:
     * one edit for words of up to four letters (so "at" does not become "to"), two edits for longer ones.
     */
    String suggestionFor(Token found) {
        if (found.kind() != Token.Kind.WORD) {
            return null;
        }
        String word = found.lower();
        int allowed = word.length() <= 4 ? 1 : 2;
        String best = null;
        int bestDistance = Integer.MAX_VALUE;
        for (String keyword : keywords) {
            int distance = EditDistance.between(word, keyword.toLowerCase(Locale.ROOT), allowed);
            if (distance > 0 && distance <= allowed && distance < bestDistance) {
                best = keyword;
                bestDistance = distance;
            }
        }
        return best;
    }
}
