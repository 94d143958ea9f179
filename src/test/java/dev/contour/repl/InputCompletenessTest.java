package dev.contour.repl;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class InputCompletenessTest {
    @ParameterizedTest(name = "[{0}] needs more: {1}")
    @CsvSource(delimiter = '|', value = {
            "let a = 1                 | false",
            "let a = (1 +              | true",
            "let a = {1, 2             | true",
            "let a = b[1               | true",
            "let a = 1 +               | true",
            "let a = 1 *   # a comment | true",
            "let a = 1 # (             | false",
            "show \"(\"                 | false",
            "show \"open string        | false",
            "let a = 1)                | false",
            "show {1, 2)               | false",
            "let r = 1..               | true",
            "show M at                 | true",
            "let a =                   | true",
            "show x!                   | false",
            "for i in 1..3 {           | true",
            "for i in 1..3 { show i }  | false",
            "rule swap-sides:          | true",
            "let q = 2.5               | false",
    })
    void decidesWhetherInputContinues(String text, boolean expected) {
        assertEquals(expected, InputCompleteness.needsMore(text.strip()));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            "let a = (1 +\\n 2)      | false",
            "def f(x) =\\n  x        | false",
            "show {1,\\n 2,\\n       | true",
    })
    void looksAtAllTheLines(String text, boolean expected) {
        assertEquals(expected, InputCompleteness.needsMore(text.strip().replace("\\n", "\n")));
    }
}
