package org.spectralsieve.importers.jcamp;

import java.io.IOException;
import java.io.Reader;
import java.util.Arrays;

/**
 * The whole file as one char array with line boundaries, so the data decoders run over plain
 * offsets and never allocate a String per line or per character.
 */
final class TextLines {

    /** DOS end-of-file mark that old JCAMP writers append after {@code ##END=}. */
    private static final char CTRL_Z = '\u001A';

    final char[] chars;
    private final int[] starts;
    private final int[] ends;
    private final int count;

    private TextLines(char[] chars, int length) {
        this.chars = chars;
        IntBuffer s = new IntBuffer();
        IntBuffer e = new IntBuffer();
        int p = length > 0 && chars[0] == '\uFEFF' ? 1 : 0;
        while (p < length) {
            int start = p;
            while (p < length && chars[p] != '\n' && chars[p] != '\r') {
                p++;
            }
            s.add(start);
            e.add(p);
            if (p < length && chars[p] == '\r' && p + 1 < length && chars[p + 1] == '\n') {
                p++;
            }
            p++;
        }
        this.starts = s.toArray();
        this.ends = e.toArray();
        this.count = starts.length;
    }

    static TextLines read(Reader in) throws IOException {
        char[] buf = new char[1 << 14];
        int length = 0;
        int n;
        while ((n = in.read(buf, length, buf.length - length)) >= 0) {
            length += n;
            if (length == buf.length) {
                buf = Arrays.copyOf(buf, buf.length * 2);
            }
        }
        return new TextLines(buf, trimTrailingCtrlZ(buf, length));
    }

    static TextLines of(CharSequence text) {
        char[] c = text.toString().toCharArray();
        return new TextLines(c, trimTrailingCtrlZ(c, c.length));
    }

    /** Only a trailing Ctrl-Z is an end mark; one in the middle stays and is reported where it sits. */
    private static int trimTrailingCtrlZ(char[] c, int length) {
        int end = length;
        while (end > 0 && (c[end - 1] == CTRL_Z || Character.isWhitespace(c[end - 1]))) {
            end--;
        }
        return end < length ? end : length;
    }

    int count() {
        return count;
    }

    int start(int line) {
        return starts[line];
    }

    int end(int line) {
        return ends[line];
    }

    /** End of the line without a {@code $$} comment. */
    int endWithoutComment(int line) {
        int e = ends[line];
        for (int p = starts[line]; p + 1 < e; p++) {
            if (chars[p] == '$' && chars[p + 1] == '$') {
                return p;
            }
        }
        return e;
    }

    String text(int line) {
        return new String(chars, starts[line], ends[line] - starts[line]);
    }

    /** 1-based, as users count lines. */
    static int number(int line) {
        return line + 1;
    }
}
