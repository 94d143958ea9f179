package dev.contour.algebra;

import java.util.function.BinaryOperator;

/** Non-negative integer powers by repeated squaring, shared by every ring type of the package. */
final class Powers {
    private Powers() { }

    /** base^exponent for exponent >= 0, with about 2 log2(exponent) multiplications. */
    static <T> T bySquaring(T one, T base, int exponent, BinaryOperator<T> multiply) {
        T result = one;
        int e = exponent;
        while (e > 0) {
            dev.contour.Cancellation.check();
            if ((e & 1) != 0) {
                result = multiply.apply(result, base);
            }
            e >>= 1;
            if (e > 0) {
                base = multiply.apply(base, base);
            }
        }
        return result;
    }
}
