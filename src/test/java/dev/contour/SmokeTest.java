package dev.contour;
import net.jqwik.api.*;
import org.junit.jupiter.api.Test;
import static org.junit.jupiter.api.Assertions.*;
class SmokeTest {
    @Test void junitRuns() { assertEquals(2, 1 + 1); }
    @Property(tries = 10) void jqwikRuns(@ForAll int a) { assertEquals(a, a + 0); }
    @Test void ringsLoads() {
        var r = cc.redberry.rings.Rings.MultivariateRingQ(2);
        assertNotNull(r.parse("x^2 - y"));
    }
}
