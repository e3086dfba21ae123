package org.specimenledger.curve;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * The one header row: which delimiter the file uses, and which column carries which channel in
 * which unit.
 *
 * <p>The delimiter is the only one of tab, semicolon and comma that occurs in the header row. A row
 * with more than one of them is rejected instead of guessed at, because a wrong guess would silently
 * shift every column. Cells are {@code name [unit]}; unknown names are ignored with a warning (real
 * machines add temperature and similar columns), known names need exactly one accepted unit.
 */
final class HeaderRow {

    private final byte delimiter;
    private final int cellCount;
    private final Channel[] channelOfColumn;
    private final UnitFactor[] factorOfColumn;
    private final List<ChannelColumn> channels;

    private HeaderRow(byte delimiter, Channel[] channelOfColumn, UnitFactor[] factorOfColumn,
            List<ChannelColumn> channels) {
        this.delimiter = delimiter;
        this.cellCount = channelOfColumn.length;
        this.channelOfColumn = channelOfColumn;
        this.factorOfColumn = factorOfColumn;
        this.channels = List.copyOf(channels);
    }

    static HeaderRow parse(byte[] b, int from, int to, int line, List<String> warnings) {
        String text = Utf8Text.decode(b, from, to, line, Utf8Text.NO_DELIMITER);
        char delimiter = detectDelimiter(text, line);
        List<String> cells = split(text, delimiter);
        Channel[] channelOfColumn = new Channel[cells.size()];
        UnitFactor[] factorOfColumn = new UnitFactor[cells.size()];
        Map<Channel, ChannelColumn> found = new EnumMap<>(Channel.class);
        for (int i = 0; i < cells.size(); i++) {
            int column = i + 1;
            String cell = cells.get(i).strip();
            int open = cell.indexOf('[');
            Channel channel = Channel.byLabel(open < 0 ? cell : cell.substring(0, open));
            if (channel == null) {
                warnings.add(cell.isEmpty()
                        ? "column " + column + " has an empty header cell; its values are ignored"
                        : "column " + column + " \"" + cell + "\" is not a known channel (time, force, extension, "
                                + "crosshead); its values are ignored");
                continue;
            }
            String unit = unitOf(cell, open, channel, line, column);
            UnitFactor factor = channel.factorFor(unit);
            if (factor == null) {
                throw new CurveRejected(line, column, "unknown " + channel.label() + " unit \"" + unit + "\"; use "
                        + channel.unitHint());
            }
            ChannelColumn earlier = found.get(channel);
            if (earlier != null) {
                throw new CurveRejected(line, column, "channel \"" + channel.label() + "\" appears twice, in columns "
                        + earlier.column() + " and " + column);
            }
            found.put(channel, new ChannelColumn(channel, unit, column));
            channelOfColumn[i] = channel;
            factorOfColumn[i] = factor;
        }
        for (Channel channel : Channel.values()) {
            // A crosshead-only record (no extensometer fitted) may leave the extension channel out.
            boolean standsIn = channel == Channel.EXTENSION && found.containsKey(Channel.CROSSHEAD);
            if (channel.required() && !found.containsKey(channel) && !standsIn) {
                throw new CurveRejected(line, 0, "the header row has no " + channel.label() + " channel"
                        + (channel == Channel.EXTENSION ? " (nor a crosshead channel to stand in for it)" : "")
                        + "; found \"" + text.strip() + "\"");
            }
        }
        List<ChannelColumn> inColumnOrder = new ArrayList<>(found.values());
        inColumnOrder.sort((x, y) -> Integer.compare(x.column(), y.column()));
        return new HeaderRow((byte) delimiter, channelOfColumn, factorOfColumn, inColumnOrder);
    }

    byte delimiter() {
        return delimiter;
    }

    int cellCount() {
        return cellCount;
    }

    /** The channel in the 0-based column, or null for an ignored column. */
    Channel channelOf(int index) {
        return channelOfColumn[index];
    }

    UnitFactor factorOf(int index) {
        return factorOfColumn[index];
    }

    List<ChannelColumn> channels() {
        return channels;
    }

    private static String unitOf(String cell, int open, Channel channel, int line, int column) {
        if (open < 0) {
            throw new CurveRejected(line, column, "the " + channel.label() + " column \"" + cell
                    + "\" has no unit; write it in brackets, e.g. \"" + channel.label() + " ["
                    + channel.canonicalUnit() + "]\"");
        }
        int close = cell.indexOf(']', open);
        if (close != cell.length() - 1 || cell.indexOf('[', open + 1) >= 0) {
            throw new CurveRejected(line, column, "header cell \"" + cell + "\" is not of the form \"name [unit]\"");
        }
        String unit = cell.substring(open + 1, close).strip();
        if (unit.isEmpty()) {
            throw new CurveRejected(line, column, "the " + channel.label() + " column \"" + cell
                    + "\" has an empty unit; use " + channel.unitHint());
        }
        return unit;
    }

    private static char detectDelimiter(String text, int line) {
        List<String> present = new ArrayList<>();
        char chosen = 0;
        for (char candidate : new char[] {'\t', ';', ','}) {
            if (text.indexOf(candidate) >= 0) {
                present.add(candidate == '\t' ? "tab" : "\"" + candidate + "\"");
                chosen = candidate;
            }
        }
        if (present.size() > 1) {
            throw new CurveRejected(line, 0, "the header row mixes delimiters (" + String.join(" and ", present)
                    + "); use only one of comma, semicolon or tab");
        }
        if (present.isEmpty()) {
            throw new CurveRejected(line, 0, "the header row \"" + text.strip() + "\" has no comma, semicolon or tab;"
                    + " a curve needs at least a force and an extension column");
        }
        return chosen;
    }

    private static List<String> split(String text, char delimiter) {
        List<String> cells = new ArrayList<>();
        int from = 0;
        for (int i = 0; i <= text.length(); i++) {
            if (i == text.length() || text.charAt(i) == delimiter) {
                cells.add(text.substring(from, i));
                from = i + 1;
            }
        }
        return cells;
    }
}
