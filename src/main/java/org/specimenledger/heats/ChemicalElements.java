package org.specimenledger.heats;

import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * The 118 element symbols of the IUPAC periodic table, in order of atomic number (symbols of 113, 115,
 * 117 and 118 as named by IUPAC in 2016). Symbols are case-sensitive: {@code Co} is cobalt, {@code CO}
 * is not an element.
 */
final class ChemicalElements {

    private static final List<String> SYMBOLS = List.of(
            "H", "He",
            "Li", "Be", "B", "C", "N", "O", "F", "Ne",
            "Na", "Mg", "Al", "Si", "P", "S", "Cl", "Ar",
            "K", "Ca", "Sc", "Ti", "V", "Cr", "Mn", "Fe", "Co", "Ni", "Cu", "Zn", "Ga", "Ge", "As", "Se", "Br", "Kr",
            "Rb", "Sr", "Y", "Zr", "Nb", "Mo", "Tc", "Ru", "Rh", "Pd", "Ag", "Cd", "In", "Sn", "Sb", "Te", "I", "Xe",
            "Cs", "Ba",
            "La", "Ce", "Pr", "Nd", "Pm", "Sm", "Eu", "Gd", "Tb", "Dy", "Ho", "Er", "Tm", "Yb", "Lu",
            "Hf", "Ta", "W", "Re", "Os", "Ir", "Pt", "Au", "Hg", "Tl", "Pb", "Bi", "Po", "At", "Rn",
            "Fr", "Ra",
            "Ac", "Th", "Pa", "U", "Np", "Pu", "Am", "Cm", "Bk", "Cf", "Es", "Fm", "Md", "No", "Lr",
            "Rf", "Db", "Sg", "Bh", "Hs", "Mt", "Ds", "Rg", "Cn", "Nh", "Fl", "Mc", "Lv", "Ts", "Og");

    private static final Map<String, Integer> ATOMIC_NUMBER = new HashMap<>();
    private static final Map<String, String> BY_LOWER_CASE = new HashMap<>();

    static {
        for (int i = 0; i < SYMBOLS.size(); i++) {
            ATOMIC_NUMBER.put(SYMBOLS.get(i), i + 1);
            BY_LOWER_CASE.put(SYMBOLS.get(i).toLowerCase(Locale.ROOT), SYMBOLS.get(i));
        }
    }

    private ChemicalElements() {
    }

    static int count() {
        return SYMBOLS.size();
    }

    static boolean isSymbol(String symbol) {
        return symbol != null && ATOMIC_NUMBER.containsKey(symbol);
    }

    /** The atomic number of a symbol (1 for H ... 118 for Og); 0 when it is not a symbol. */
    static int atomicNumber(String symbol) {
        return symbol == null ? 0 : ATOMIC_NUMBER.getOrDefault(symbol, 0);
    }

    /** The correctly capitalised symbol when only the case was wrong ({@code MN} → {@code Mn}). */
    static Optional<String> properCase(String symbol) {
        return symbol == null ? Optional.empty()
                : Optional.ofNullable(BY_LOWER_CASE.get(symbol.toLowerCase(Locale.ROOT)));
    }

    /** A copy of {@code bySymbol} ordered by atomic number, the order a mill certificate lists them in. */
    static <V> Map<String, V> inAtomicOrder(Map<String, V> bySymbol) {
        Map<String, V> out = new LinkedHashMap<>();
        bySymbol.keySet().stream()
                .sorted(Comparator.comparingInt(ChemicalElements::atomicNumber).thenComparing(Comparator.naturalOrder()))
                .forEach(s -> out.put(s, bySymbol.get(s)));
        return out;
    }
}
