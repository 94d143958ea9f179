// The Contour language: derivation scripts and rule libraries.
//
// Newlines are insignificant: every statement opens with its own keyword, so a statement ends
// where the next keyword starts (an optional ';' may separate statements on one line).
// Generated classes never leave dev.contour.lang (the parse adapter turns them into AST records).
grammar Contour;

script : statement* EOF ;

// One statement, for the REPL and for tests that parse a single line.
singleStatement : statement EOF ;

// One expression (print-then-parse round trips, the REPL's bare expressions).
singleExpression : expr EOF ;

statement
    : 'vars' IDENT (',' IDENT)* COLLECTED?                            # varsStatement
    | 'let' IDENT '=' expr                                            # letStatement
    | 'def' IDENT '(' (IDENT (',' IDENT)*)? ')' '=' expr              # defStatement
    | 'unknown' IDENT '[' binder (',' binder)* ']' constraints?       # unknownStatement
    | 'use' STRING                                                    # useStatement
    | 'show' expr showOption*                                         # showStatement
    | 'check' expr '==' expr                                          # checkStatement
    | 'for' IDENT 'in' arith block                                    # forStatement
    | 'rule' ruleName ':' expr 'becomes' expr ('when' expr (',' expr)*)?   # ruleStatement
    | 'derive' expr usingClause? withinClause?                        # deriveStatement
    | 'check' expr '==' expr 'by' 'rules' usingClause? withinClause?  # checkByRulesStatement
    | ';'                                                             # emptyStatement
    ;

block : '{' statement* '}' ;

ruleName : ruleWord ('-' ruleWord)* ;
// Kebab-case rule names may use the language's keywords as words (gamma-shift-by-one, sum-of-poch).
ruleWord : IDENT | COLLECTED | 'as' | 'at' | 'becomes' | 'by' | 'check' | 'def' | 'derive' | 'factored' | 'for'
         | 'in' | 'let' | 'normalized' | 'rule' | 'rules' | 'show' | 'solve' | 'step' | 'sum' | 'unknown' | 'use'
         | 'using' | 'vars' | 'when' | 'with' | 'within' ;

// Which rule libraries a derivation uses (default: the rules the session has loaded), and its
// limits, e.g. 'within 500 steps, 2000 nodes, 5 seconds' (the unit is checked by the engine).
usingClause : 'using' STRING (',' STRING)* ;
withinClause : 'within' rewriteLimit (',' rewriteLimit)* ;
rewriteLimit : NUMBER IDENT ;

showOption
    : COLLECTED IDENT (',' IDENT)*      # collectedOption
    | 'factored' IDENT                  # factoredWholeOption
    | 'factored'                        # factoredOption
    | 'as' IDENT                        # formatOption
    | 'in' arith                        # formsOption
    ;

// Index sets: non-negative integers by default, narrowed by ranges and linear constraints.
binder : IDENT ('in' arith)? ;
constraints : 'with' constraint (',' constraint)* ;
constraint : arith op=('=' | '>=' | '<=' | '>' | '<') arith ;

// Loosest: index sums and solving (their bodies reach as far right as possible), then the
// postfix forms 'at' (substitution) and 'with' (apply a solution).
expr
    : expr 'at' substitution                                          # atExpr
    | expr 'with' arith ('normalized' target '=' arith)?              # withExpr
    | 'sum' binder (',' binder)* constraints? ':' expr                # sumExpr
    | 'solve' condition (',' condition)* 'for' IDENT (',' IDENT)*     # solveExpr
    | arith                                                           # arithExpr
    ;

substitution
    : '(' assignment (',' assignment)* ')'
    | assignment
    ;
assignment : target '=' arith ;
target : IDENT ('[' arith (',' arith)* ']')? ;
condition : expr ('==' expr)? ;

arith
    : primary                                                         # primaryArith
    | arith '(' (argument (',' argument)*)? ')'                       # callArith
    | arith '[' arith (',' arith)* ']'                                # indexArith
    | arith '!'                                                       # factorialArith
    | <assoc=right> arith '^' arith                                   # powerArith
    | op=('-' | '+') arith                                            # unaryArith
    | arith op=('*' | '/') arith                                      # productArith
    | arith op=('+' | '-') arith                                      # sumArith
    | arith '..' arith ('step' arith)?                                # rangeArith
    ;

argument
    : argumentName ':' expr  # namedArgument
    | IDENT 'in' arith       # domainArgument
    | expr                   # plainArgument
    ;

// A named argument's name may be one of the words 'by' (partial_fractions(M, s, by: {sigma, tau}))
// or 'within' (a time limit, as in a derivation's within clause): before ':' neither can start an
// expression, so reading it as a name is unambiguous.
argumentName : IDENT | 'by' | 'within' ;

primary
    : NUMBER                                   # numberPrimary
    | IDENT                                    # namePrimary
    | STRING                                   # stringPrimary
    | '(' expr ')'                             # parenPrimary
    | '{' (expr (',' expr)*)? '}'              # listPrimary
    | PATTERN_VAR                              # patternPrimary
    ;

COLLECTED : 'collected' ;
NUMBER : [0-9]+ ('.' [0-9]+)? ;
IDENT : [a-zA-Z_] [a-zA-Z_0-9]* ;
// A pattern variable of a rule: '@x' matches any subterm (guards narrow it).
PATTERN_VAR : '@' [a-zA-Z_] [a-zA-Z_0-9]* ;
STRING : '"' (~["\\\r\n] | '\\' ["\\nt])* '"' ;
UNTERMINATED_STRING : '"' (~["\\\r\n] | '\\' .)* ;
COMMENT : '#' ~[\r\n]* -> skip ;
WS : [ \t\r\n\f]+ -> skip ;
// Anything else becomes one token that the parser rejects with a clear message.
STRAY : . ;
