package dev.contour.eval;

import java.util.Collection;

/** "Did you mean ...?": the nearest known name by edit distance, when it is near enough. */
public final class Suggestions {
    private Suggestions() { }

    /** The closest candidate within a distance that grows with the name's length, or null. */
    public static String nearest(String name, Collection<String> candidates) {
        String best = null;
        int bestDistance = Integer.MAX_VALUE;
        int allowed = name.length() <= 2 ? 1 : name.length() <= 5 ? 2 : 3;
        for (String c : candidates) {
            if (c.equalsIgnoreCase(name)) {
                return c; // a slip of the shift key beats any other near name
            }
        }
        for (String c : candidates) {
            int d = distance(name, c);
            if (d <= allowed && d < bestDistance) {
                best = c;
                bestDistance = d;
            }
        }
        return best;
    }

    /** Edit distance where swapping two neighbouring letters counts as one edit. */
    static int distance(String a, String b) {
        int[][] d = new int[a.length() + 1][b.length() + 1];
        for (int i = 0; i <= a.length(); i++) {
            d[i][0] = i;
        }
        for (int j = 0; j <= b.length(); j++) {
            d[0][j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            for (int j = 1; j <= b.length(); j++) {
                int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                d[i][j] = Math.min(Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1), d[i - 1][j - 1] + cost);
                if (i > 1 && j > 1 && a.charAt(i - 1) == b.charAt(j - 2) && a.charAt(i - 2) == b.charAt(j - 1)) {
                    d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
                }
            }
        }
        return d[a.length()][b.length()];
    }
}
