package dev.contour.eval;

/** The outcome of running a script: how many checks held and how many failed. */
public record RunResult(int checksPassed, int checksFailed) {
    public boolean ok() {
        return checksFailed == 0;
    }

    public RunResult plus(RunResult o) {
        return new RunResult(checksPassed + o.checksPassed, checksFailed + o.checksFailed);
    }
}
