package dev.contour.eval;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;

/**
 * An indexed family of unknowns from {@code unknown a[i, j] with ...}: each member is a collected
 * variable named like {@code a[0,1]}, recorded for the solver.
 */
public record UnknownFamilyValue(String name, List<String> indexNames, List<List<Integer>> members, String description)
        implements Value {
    public UnknownFamilyValue {
        indexNames = List.copyOf(indexNames);
        members = members.stream().map(List::copyOf).toList();
    }

    /** The variable name of one member: {@code a[0,1,0]}. */
    public static String memberName(String family, List<Integer> indices) {
        return family + indices.stream().map(String::valueOf).collect(Collectors.joining(",", "[", "]"));
    }

    /** Member names in declaration order. */
    public List<String> memberNames() {
        return members.stream().map(m -> memberName(name, m)).toList();
    }

    /** Member name to its collected variable, in declaration order. */
    public Map<String, Expression> variables() {
        Map<String, Expression> out = new LinkedHashMap<>();
        for (String m : memberNames()) {
            out.put(m, Expression.collectedVariable(m));
        }
        return out;
    }

    /** The collected variable for {@code name[indices]}; a located error when it is not a member. */
    public Expression member(List<Integer> indices, Span span) {
        if (indices.size() != indexNames.size()) {
            throw new ContourException(name + " takes " + indexNames.size() + " indices, not " + indices.size(), span);
        }
        if (!members.contains(indices)) {
            throw new ContourException(memberName(name, indices) + " is not in the family " + description, span);
        }
        return Expression.collectedVariable(memberName(name, indices));
    }

    @Override
    public String kind() {
        return "unknown family";
    }
}
