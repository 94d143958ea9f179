package dev.contour.repl;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Where the REPL keeps its history when no --history is given. */
class ReplSettingsTest {
    @Test
    void historyFollowsContourHistoryThenHomeThenTheAccount() {
        assertEquals(Path.of("/data/h.txt"),
                ReplSettings.defaultHistoryFile(Map.of("CONTOUR_HISTORY", "/data/h.txt", "HOME", "/home/x"), "/root"));
        assertNull(ReplSettings.defaultHistoryFile(Map.of("CONTOUR_HISTORY", ""), "/root"), "empty: no history");
        // ~ is $HOME, as in the shell, even when the account's home differs
        assertEquals(Path.of("/tmp/elsewhere/.contour_history"),
                ReplSettings.defaultHistoryFile(Map.of("HOME", "/tmp/elsewhere"), "/root"));
        assertEquals(Path.of("/root/.contour_history"), ReplSettings.defaultHistoryFile(Map.of(), "/root"));
    }
}
