package org.spectralsieve.importers.jcamp;

import java.util.Objects;
import java.util.OptionalInt;
import org.spectralsieve.importers.ReadOptions;
import org.spectralsieve.importers.YKind;

/**
 * Choices for one JCAMP read. Immutable; start from {@link #defaults()}.
 *
 * @param read  the general import choices (a forced y kind overrides YUNITS, even an unknown one)
 * @param block which block to read, as {@link JcampBlock#index()}; empty = the first block with data
 */
public record JcampOptions(ReadOptions read, OptionalInt block) {

    public JcampOptions {
        Objects.requireNonNull(read, "read");
        Objects.requireNonNull(block, "block");
        if (block.isPresent() && block.getAsInt() < 0) {
            throw new IllegalArgumentException("block index must be >= 0, was " + block.getAsInt());
        }
    }

    public static JcampOptions defaults() {
        return new JcampOptions(ReadOptions.defaults(), OptionalInt.empty());
    }

    public JcampOptions withYKind(YKind kind) {
        return new JcampOptions(read.withYKind(kind), block);
    }

    /** Reads block {@code index} of {@link JcampReader#blocks} (0 is a LINK file's outer block). */
    public JcampOptions withBlock(int index) {
        return new JcampOptions(read, OptionalInt.of(index));
    }
}
