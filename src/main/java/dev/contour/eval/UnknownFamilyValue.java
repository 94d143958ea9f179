package dev.contour.eval;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.Set;
import java.util.List;
import java.util.Map;

/**
 * An indexed family of unknowns from {@code unknown a[i, j] with ...}: each member is a collected
 * variable named like {@code a[0,1]}, recorded for the solver.
 */
public final class UnknownFamilyValue implements Value {
    private final String name;
    private final List<String> indexNames;
    private final List<List<Integer>> members;
    /** Member names: their string hashes spread well, where List<Integer> hashes of i + j + k = n collide in long chains. */
    private final Set<String> memberSet;
    private final String description;

    /**
     * @param members     the index tuples in declaration order
     * @param description the family as declared, for error messages ({@code a[i, j] with i + j = 2})
     */
    public UnknownFamilyValue(String name, List<String> indexNames, List<List<Integer>> members, String description) {
        this.name = name;
        this.indexNames = List.copyOf(indexNames);
        this.members = members.stream().map(List::copyOf).toList();
        this.memberSet = new HashSet<>(this.members.size() * 4 / 3 + 1);
        for (List<Integer> m : this.members) {
            memberSet.add(memberName(name, m));
        }
        this.description = description;
    }

    public String name() {
        return name;
    }

    public List<String> indexNames() {
        return indexNames;
    }

    public List<List<Integer>> members() {
        return members;
    }

    public String description() {
        return description;
    }

    /** The variable name of one member: {@code a[0,1,0]}. */
    public static String memberName(String family, List<Integer> indices) {
        // A plain builder rather than a stream: sums over an ansatz name one member per term.
        StringBuilder sb = new StringBuilder(family.length() + 4 * indices.size() + 2).append(family).append('[');
        for (int i = 0; i < indices.size(); i++) {
            if (i > 0) {
                sb.append(',');
            }
            sb.append(indices.get(i).intValue());
        }
        return sb.append(']').toString();
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
        String member = memberName(name, indices);
        if (!memberSet.contains(member)) {
            throw new ContourException(member + " is not in the family " + description, span);
        }
        return Expression.collectedVariable(member);
    }

    @Override
    public String kind() {
        return "unknown family";
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof UnknownFamilyValue u && u.name.equals(name) && u.indexNames.equals(indexNames)
                && u.members.equals(members);
    }

    @Override
    public int hashCode() {
        return name.hashCode() * 31 + members.hashCode();
    }

    @Override
    public String toString() {
        return "UnknownFamilyValue[" + description + "]";
    }
}
