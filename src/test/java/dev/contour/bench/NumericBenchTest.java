package dev.contour.bench;


import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/** {@code mvn -Pbench test}: prints the box-function figures; asserts the numbers, never the time. */
@Tag("bench")
class NumericBenchTest {

    @Test
    void boxFunctionToFifteenDigits() {
        NumericBench.Figures m = NumericBench.measure();
        System.out.printf("numeric bench: box function, %d digits: integral %s in %.2f s wall, %.2f s CPU "
                        + "(%,d evaluations); closed form %.2f s; agreement %.1f digits%n", NumericBench.DIGITS, m.integral(),
                m.integralSeconds(), m.integralCpuSeconds(), m.evaluations(), m.closedFormSeconds(), m.agreementDigits());
        // Closed form: Usyukina and Davydychev, Phys. Lett. B 298 (1993) 363.
        assertTrue(m.integral().digits() >= NumericBench.DIGITS, m.integral()::toString);
        assertTrue(m.agreementDigits() >= m.integral().digits() - 0.5, () -> m.agreementDigits() + " digits agree");
        // The same number as users compute it: the measure written in a script, through the interpreter.
        NumericBench.ScriptFigures sf = NumericBench.measureScript();
        System.out.printf("numeric bench: script path %s in %.2f s wall, %.2f s CPU (%.2f times the hand-written integrand)%n",
                sf.value().digitsText(), sf.seconds(), sf.cpuSeconds(), sf.seconds() / m.integralSeconds());
        assertTrue(sf.value().result().digits() >= NumericBench.DIGITS, sf::line);
        assertTrue(-sf.value().result().log10RelativeDistance(m.closedForm().value()) >= NumericBench.DIGITS - 0.5, sf::line);
    }
}
