package dev.contour.rewrite;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/**
 * Random terms over the functions of the bundled rule sets, as source text: sums of products of
 * Gamma functions, Pochhammer symbols (integer and symbolic lengths), factorials and binomials in
 * x, y and a, with integer and fractional shifts, to powers 1, 2 and -1.
 */
final class RandomTerms {
    private final Random random;

    RandomTerms(long seed) {
        random = new Random(seed);
    }

    String term() {
        List<String> monomials = new ArrayList<>();
        int n = 1 + random.nextInt(2);
        for (int i = 0; i < n; i++) {
            monomials.add(monomial());
        }
        return String.join(" + ", monomials);
    }

    private String monomial() {
        List<String> factors = new ArrayList<>();
        factors.add("(" + (1 + random.nextInt(5)) + "/" + (1 + random.nextInt(3)) + ")");
        int n = 1 + random.nextInt(3);
        for (int i = 0; i < n; i++) {
            int e = random.nextInt(6);
            String atom = atom(e >= 3 && e < 5);
            factors.add(e < 3 ? atom : e < 5 ? "(" + atom + ")^-1" : "(" + atom + ")^2");
        }
        return String.join("*", factors);
    }

    /** A call; one that is to be inverted never vanishes (no binomials with an integer top or a negative k). */
    private String atom(boolean inverted) {
        if (inverted) {
            return switch (random.nextInt(5)) {
                case 0, 1, 2 -> "Gamma(" + argument() + ")";
                case 3 -> "poch(" + argument() + ", " + (random.nextInt(8) - 3) + ")";
                default -> "binom(" + argument() + ", " + random.nextInt(5) + ")";
            };
        }
        return switch (random.nextInt(8)) {
            case 0, 1, 2 -> "Gamma(" + argument() + ")";
            case 3 -> "poch(" + argument() + ", " + (random.nextInt(8) - 3) + ")";
            case 4 -> "poch(" + argument() + ", a + " + (random.nextInt(5) - 2) + ")";
            case 5 -> random.nextBoolean() ? "factorial(" + random.nextInt(6) + ")" : "factorial(" + argument() + ")";
            default -> "binom(" + (random.nextBoolean() ? argument() : String.valueOf(random.nextInt(7))) + ", "
                    + (random.nextInt(6) - 1) + ")";
        };
    }

    /** A variable (or half of one) plus an integer and sometimes a fraction. */
    private String argument() {
        String v = random.nextBoolean() ? "x" : random.nextInt(3) == 0 ? "y/2" : "y";
        int shift = random.nextInt(7) - 3;
        String fraction = switch (random.nextInt(4)) {
            case 0 -> " + 1/2";
            case 1 -> " - 1/3";
            default -> "";
        };
        return v + (shift < 0 ? " - " + -shift : " + " + shift) + fraction;
    }
}
