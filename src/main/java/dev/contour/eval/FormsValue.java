package dev.contour.eval;

import dev.contour.print.FormView;

import java.util.List;

/**
 * A value that names linear forms for printing ({@code show M in m}): a measure names s, t and its
 * eliminated variable (u = total - s - t).
 */
public interface FormsValue extends Value {
    List<FormView.Form> forms();
}
