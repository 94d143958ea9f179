package dev.contour.lang;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.lang.gen.ContourLexer;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.List;
import org.antlr.v4.runtime.DefaultErrorStrategy;
import org.antlr.v4.runtime.InputMismatchException;
import org.antlr.v4.runtime.Parser;
import org.antlr.v4.runtime.RecognitionException;
import org.antlr.v4.runtime.Token;
import org.antlr.v4.runtime.TokenStream;
import org.antlr.v4.runtime.Vocabulary;
import org.antlr.v4.runtime.misc.IntervalSet;

/**
 * Stops at the first syntax error and reports it in our own words as a located
 * {@link ContourException}: what was expected, what was found, and which bracket is still open.
 */
final class SyntaxErrorStrategy extends DefaultErrorStrategy {
    private final String file;

    SyntaxErrorStrategy(String file) {
        this.file = file;
    }

    @Override
    public void reportError(Parser recognizer, RecognitionException e) {
        Token found = e.getOffendingToken() != null ? e.getOffendingToken() : recognizer.getCurrentToken();
        IntervalSet expected = e.getExpectedTokens() != null ? e.getExpectedTokens() : recognizer.getExpectedTokens();
        throw error(recognizer, found, expected);
    }

    @Override
    public void recover(Parser recognizer, RecognitionException e) {
        reportError(recognizer, e);
    }

    @Override
    public Token recoverInline(Parser recognizer) {
        throw error(recognizer, recognizer.getCurrentToken(), recognizer.getExpectedTokens());
    }

    @Override
    protected void reportUnwantedToken(Parser recognizer) {
        throw error(recognizer, recognizer.getCurrentToken(), recognizer.getExpectedTokens());
    }

    @Override
    protected void reportMissingToken(Parser recognizer) {
        throw error(recognizer, recognizer.getCurrentToken(), recognizer.getExpectedTokens());
    }

    @Override
    public void sync(Parser recognizer) {
        // Errors are reported where the parser fails; sync's early recovery would only muddle them.
    }

    private ContourException error(Parser recognizer, Token found, IntervalSet expected) {
        Span where = spanOf(found);
        Vocabulary vocabulary = recognizer.getVocabulary();
        if (found.getType() == ContourLexer.STRAY) {
            return new ContourException("unexpected character '" + found.getText() + "'", where);
        }
        if (found.getType() == ContourLexer.UNTERMINATED_STRING) {
            return new ContourException("unterminated string: it needs a closing '\"' on the same line", where);
        }
        String foundText = describeFound(found);
        Token opener = unclosedOpener(recognizer.getInputStream(), found);
        // At the end of the input an unclosed bracket is the error whatever the parser was predicting
        // (after '1/f(1' it may have settled on a shorter statement and expect the next one).
        if (opener != null && (expected.contains(closerType(recognizer, opener)) || found.getType() == Token.EOF)) {
            String close = closerOf(opener.getText());
            return new ContourException("expected '" + close + "' to close '" + opener.getText() + "' opened at "
                    + opener.getLine() + ":" + (opener.getCharPositionInLine() + 1) + ", found " + foundText, where);
        }
        boolean statementEnd = expected.size() <= 2 && (expected.contains(Token.EOF) || expected.contains(tokenType(vocabulary, "'}'")));
        if (statementEnd && found.getType() == ContourLexer.IDENT
                && "=".equals(recognizer.getInputStream().LT(2) == null ? null : recognizer.getInputStream().LT(2).getText())) {
            return new ContourException("expected a statement, found '" + found.getText() + "'; to name a value write 'let "
                    + found.getText() + " = ...'", where);
        }
        if (statementEnd && found.getType() != Token.EOF && !found.getText().equals("}")) {
            return new ContourException("expected a statement (vars, let, def, unknown, use, show, check, for, rule, derive), found "
                    + foundText, where);
        }
        Token previous = found.getTokenIndex() > 0 ? recognizer.getInputStream().get(found.getTokenIndex() - 1) : null;
        if (previous != null && previous.getText().equals("solve") && (found.getText().equals("for") || found.getType() == Token.EOF)) {
            return new ContourException("'solve' needs the conditions to solve before 'for' (solve CONDITION, ... for"
                    + " UNKNOWNS), and none are given", spanOf(previous));
        }
        if (isKeyword(found, vocabulary) && expected.contains(ContourLexer.IDENT)) {
            return new ContourException("'" + found.getText() + "' is a keyword and cannot be used as a name", where);
        }
        if (found.getType() == Token.EOF && expected.contains(Token.EOF)) {
            // "expected end of input, found end of input" would contradict itself: the parser failed
            // earlier than it noticed, so the last statement is what is incomplete.
            return new ContourException("the input ends inside an unfinished statement", where);
        }
        return new ContourException("expected " + describeExpected(expected, vocabulary) + ", found " + foundText, where);
    }

    private Span spanOf(Token t) {
        int length = t.getType() == Token.EOF ? 1 : Math.max(1, t.getStopIndex() - t.getStartIndex() + 1);
        return new Span(file, Math.max(1, t.getLine()), t.getCharPositionInLine() + 1, length);
    }

    private static String describeFound(Token t) {
        if (t.getType() == Token.EOF) {
            return "end of input";
        }
        return "'" + t.getText() + "'";
    }

    private static boolean isKeyword(Token t, Vocabulary vocabulary) {
        String literal = vocabulary.getLiteralName(t.getType());
        return literal != null && Character.isLetter(literal.charAt(1));
    }

    private static String describeExpected(IntervalSet expected, Vocabulary vocabulary) {
        if (expected.contains(ContourLexer.NUMBER) && expected.contains(ContourLexer.IDENT)) {
            return "an expression";
        }
        List<String> names = new ArrayList<>();
        boolean statement = false;
        for (int type : expected.toArray()) {
            String literal = vocabulary.getLiteralName(type);
            if (literal != null && List.of("'let'", "'show'", "'vars'").contains(literal)) {
                statement = true;
            }
        }
        if (statement) {
            return expected.contains(Token.EOF) ? "a statement or end of input"
                    : expected.contains(tokenType(vocabulary, "'}'")) ? "a statement or '}'" : "a statement";
        }
        for (int type : expected.toArray()) {
            names.add(describeType(type, vocabulary));
        }
        if (names.isEmpty()) {
            return "something else";
        }
        if (names.size() > 5) {
            names = names.subList(0, 5);
            names.add("...");
        }
        return names.size() == 1 ? names.get(0) : String.join(", ", names.subList(0, names.size() - 1)) + " or " + names.get(names.size() - 1);
    }

    private static String describeType(int type, Vocabulary vocabulary) {
        if (type == Token.EOF) {
            return "end of input";
        }
        if (type == ContourLexer.IDENT) {
            return "a name";
        }
        if (type == ContourLexer.NUMBER) {
            return "a number";
        }
        if (type == ContourLexer.STRING) {
            return "a string";
        }
        return vocabulary.getDisplayName(type);
    }

    private static int tokenType(Vocabulary vocabulary, String literal) {
        for (int t = 0; t <= vocabulary.getMaxTokenType(); t++) {
            if (literal.equals(vocabulary.getLiteralName(t))) {
                return t;
            }
        }
        return -1;
    }

    private static int closerType(Parser recognizer, Token opener) {
        return tokenType(recognizer.getVocabulary(), "'" + closerOf(opener.getText()) + "'");
    }

    private static String closerOf(String opener) {
        return switch (opener) {
            case "(" -> ")";
            case "[" -> "]";
            default -> "}";
        };
    }

    /** The innermost bracket opened before {@code found} and not yet closed, or null. */
    private static Token unclosedOpener(TokenStream tokens, Token found) {
        Deque<Token> open = new ArrayDeque<>();
        int end = found.getTokenIndex() < 0 ? tokens.size() : found.getTokenIndex();
        for (int i = 0; i < end && i < tokens.size(); i++) {
            Token t = tokens.get(i);
            if (t.getChannel() != Token.DEFAULT_CHANNEL) {
                continue;
            }
            switch (t.getText()) {
                case "(", "[", "{" -> open.push(t);
                case ")", "]", "}" -> {
                    if (!open.isEmpty()) {
                        open.pop();
                    }
                }
                default -> { }
            }
        }
        return open.peek();
    }
}
