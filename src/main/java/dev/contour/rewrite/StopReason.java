package dev.contour.rewrite;

/** Why a rewriting run stopped. */
public enum StopReason {
    /** No rule applies anywhere: the term is in normal form. */
    SATURATED("saturated"),
    /** The run took as many steps as its limit allows. */
    STEP_LIMIT("the step limit"),
    /** The term grew past its size limit. */
    SIZE_LIMIT("the size limit"),
    /** The run used up its time. */
    TIME_LIMIT("the time limit");

    private final String description;

    StopReason(String description) {
        this.description = description;
    }

    public String description() {
        return description;
    }
}
