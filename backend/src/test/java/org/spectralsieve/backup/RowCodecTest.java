package org.spectralsieve.backup;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.List;
import org.jooq.Field;
import org.jooq.Record;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.jooq.impl.SQLDataType;
import org.junit.jupiter.api.Test;

/** A row written as a JSON line reads back to the same values, bit for bit where the column is binary or floating. */
class RowCodecTest {

    private static final Field<Long> ID = DSL.field(DSL.name("ID"), SQLDataType.BIGINT.nullable(false));
    private static final Field<Double> VALUE = DSL.field(DSL.name("VALUE"), SQLDataType.DOUBLE);
    private static final Field<byte[]> BYTES = DSL.field(DSL.name("BYTES"), SQLDataType.BLOB);
    private static final Field<String> TEXT = DSL.field(DSL.name("TEXT"), SQLDataType.VARCHAR(100));
    private static final Field<OffsetDateTime> AT = DSL.field(DSL.name("AT"), SQLDataType.TIMESTAMPWITHTIMEZONE(6));
    private static final Field<LocalDate> ON = DSL.field(DSL.name("ON"), SQLDataType.LOCALDATE);
    private static final List<Field<?>> FIELDS = List.of(ID, VALUE, BYTES, TEXT, AT, ON);

    private static Object[] roundTrip(Object... values) {
        Record row = DSL.using(SQLDialect.DEFAULT).newRecord(FIELDS.toArray(Field<?>[]::new));
        row.fromArray(values);
        RowCodec codec = new RowCodec(FIELDS);
        return codec.decode(RowCodec.JSON.readTree(codec.encode(row)));
    }

    @Test
    void doublesReadBackToTheSameBitsIncludingTheOnesJsonCannotWrite() {
        // IEEE 754 edge values: smallest subnormal, largest finite, negative zero, a value with no short decimal
        double[] values = {Double.MIN_VALUE, Double.MAX_VALUE, -0.0, 0.1 + 0.2, 1.0 / 3, Math.nextUp(1.0),
                Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (double v : values) {
            Object back = roundTrip(1L, v, new byte[0], "", null, null)[1];
            assertThat(Double.doubleToRawLongBits((Double) back)).as(Double.toString(v))
                    .isEqualTo(Double.doubleToRawLongBits(v));
        }
    }

    @Test
    void bytesTextTimesAndNullsReadBackUnchanged() {
        byte[] bytes = {0, -1, 127, -128, 10, 13};
        OffsetDateTime at = OffsetDateTime.of(2026, 12, 3, 20, 30, 15, 123_456_000, ZoneOffset.ofHours(2));
        String text = "line one\nline two, quoted \"x\", an em dash \u2014 and a tab\t";

        Object[] back = roundTrip(Long.MAX_VALUE, null, bytes, text, at, LocalDate.of(2026, 2, 28));

        assertThat(back[0]).isEqualTo(Long.MAX_VALUE);
        assertThat(back[1]).isNull();
        assertThat((byte[]) back[2]).containsExactly(bytes);
        assertThat(back[3]).isEqualTo(text);
        assertThat(back[4]).isEqualTo(at);
        assertThat(back[5]).isEqualTo(LocalDate.of(2026, 2, 28));
    }

    @Test
    void aMissingColumnOrAValueOfTheWrongKindIsNamed() {
        RowCodec codec = new RowCodec(FIELDS);

        assertThatThrownBy(() -> codec.decode(RowCodec.JSON.readTree(
                "{\"id\":1,\"value\":1.5,\"bytes\":\"\",\"text\":\"\",\"at\":null,\"when\":null}")))
                .hasMessageContaining("column on is missing");
        assertThatThrownBy(() -> codec.decode(RowCodec.JSON.readTree(
                "{\"id\":\"one\",\"value\":1.5,\"bytes\":\"\",\"text\":\"\",\"at\":null,\"on\":null}")))
                .hasMessageContaining("column id").hasMessageContaining("whole number");
        assertThatThrownBy(() -> codec.decode(RowCodec.JSON.readTree(
                "{\"id\":null,\"value\":1.5,\"bytes\":\"\",\"text\":\"\",\"at\":null,\"on\":null}")))
                .hasMessageContaining("column id may not be null");
    }
}
