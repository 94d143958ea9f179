package dev.contour.print;

import java.util.Set;

/** How variable names look in LaTeX: Greek letters by name, subscripts for indices. */
final class Names {
    private static final Set<String> GREEK = Set.of("alpha", "beta", "gamma", "delta", "epsilon", "varepsilon",
            "zeta", "eta", "theta", "vartheta", "iota", "kappa", "lambda", "mu", "nu", "xi", "pi", "rho", "sigma",
            "tau", "upsilon", "phi", "varphi", "chi", "psi", "omega", "Gamma", "Delta", "Theta", "Lambda", "Xi",
            "Pi", "Sigma", "Upsilon", "Phi", "Psi", "Omega");

    /** Accents a one-letter or Greek name may end with: {@code utilde} typesets as {@code \\tilde{u}}. */
    private static final String[] ACCENTS = {"tilde", "hat", "bar"};

    private Names() { }

    static String latex(String name) {
        int bracket = name.indexOf('[');
        if (bracket > 0 && name.endsWith("]")) {
            String base = latex(name.substring(0, bracket));
            // A base with its own subscript (c_x[1,0]) is braced: LaTeX refuses a double subscript.
            return (base.contains("_") ? "{" + base + "}" : base) + "_{" + name.substring(bracket + 1, name.length() - 1) + "}";
        }
        int underscore = name.indexOf('_');
        if (underscore > 0 && underscore < name.length() - 1) {
            return latex(name.substring(0, underscore)) + "_{" + latex(name.substring(underscore + 1)) + "}";
        }
        if (GREEK.contains(name)) {
            return "\\" + name;
        }
        for (String accent : ACCENTS) {
            String base = name.endsWith(accent) ? name.substring(0, name.length() - accent.length()) : "";
            if (base.length() == 1 && Character.isLetter(base.charAt(0)) || GREEK.contains(base)) {
                return "\\" + accent + "{" + latex(base) + "}"; // utilde is ũ, sigmabar is σ̄
            }
        }
        int digits = name.length();
        while (digits > 0 && Character.isDigit(name.charAt(digits - 1))) {
            digits--;
        }
        if (digits > 0 && digits < name.length()) {
            return latex(name.substring(0, digits)) + "_{" + name.substring(digits) + "}";
        }
        if (name.length() == 1 && Character.isLetter(name.charAt(0)) || name.chars().allMatch(Character::isDigit)) {
            return name;
        }
        return upright(name);
    }

    /**
     * A name set upright, as a word: {@code \mathrm{...}} with the characters LaTeX reads as
     * commands escaped (an underscore would open a subscript, {@code a_} would not compile).
     */
    static String upright(String name) {
        return "\\mathrm{" + name.replace("\\", "\\backslash ").replace("_", "\\_").replace("^", "\\^{}")
                .replace("{", "\\{").replace("}", "\\}").replace("$", "\\$").replace("#", "\\#")
                .replace("%", "\\%").replace("&", "\\&") + "}";
    }
}
