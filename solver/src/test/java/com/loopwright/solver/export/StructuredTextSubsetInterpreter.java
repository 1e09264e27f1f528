package com.loopwright.solver.export;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * A test-only interpreter for exactly the IEC 61131-3 Structured Text subset the controller export emits: one
 * FUNCTION_BLOCK with VAR_INPUT / VAR_OUTPUT / VAR / VAR CONSTANT lists of BOOL and LREAL (optional literal
 * initial value), assignments, IF / ELSIF / ELSE, + - * /, unary - and NOT, AND, OR, comparisons, parentheses,
 * number literals, TRUE and FALSE. Anything else (another type, a function call, a loop, an undeclared name, a
 * write to a constant or an input, a type mix) throws {@link IllegalArgumentException}: the test fails. LREAL is
 * evaluated in Java double (IEC 60559 binary64, as LREAL requires); variables keep their values between calls, as
 * in a function block instance. Operator precedence from IEC 61131-3 (3rd ed.) table 71: unary, multiplicative,
 * additive, comparison, AND, OR.
 */
final class StructuredTextSubsetInterpreter {

    /** Most tokens in one block (a cap on the input). */
    static final int MAX_TOKENS = 200_000;

    private static final Set<String> TYPES = Set.of("BOOL", "LREAL");
    private static final Set<String> COMPARISONS = Set.of("=", "<>", "<", ">", "<=", ">=");

    private interface Expr {
        Object eval(Map<String, Object> v);
    }

    private interface Stmt {
        void run(Map<String, Object> v);
    }

    private final List<String> tokens;
    private int pos;
    private final Map<String, Object> values = new HashMap<>();
    private final Map<String, String> types = new HashMap<>();
    private final Set<String> constants = new java.util.HashSet<>();
    private final Set<String> inputs = new java.util.HashSet<>();
    private final List<Stmt> body;

    StructuredTextSubsetInterpreter(String source) {
        tokens = tokenize(source);
        expect("FUNCTION_BLOCK");
        identifier();
        while (peek().startsWith("VAR")) {
            declarations();
        }
        body = statements(Set.of("END_FUNCTION_BLOCK"));
        expect("END_FUNCTION_BLOCK");
        if (pos != tokens.size()) {
            throw new IllegalArgumentException("text after END_FUNCTION_BLOCK");
        }
    }

    void setInput(String name, Object value) {
        if (!inputs.contains(name)) {
            throw new IllegalArgumentException("not an input: " + name);
        }
        checkType(name, value);
        values.put(name, value);
    }

    void call() {
        for (Stmt s : body) {
            s.run(values);
        }
    }

    double real(String name) {
        return (Double) read(values, name);
    }

    boolean bool(String name) {
        return (Boolean) read(values, name);
    }

    private void declarations() {
        String section = next();
        boolean constant = false;
        if (section.equals("VAR") && peek().equals("CONSTANT")) {
            next();
            constant = true;
        } else if (!Set.of("VAR", "VAR_INPUT", "VAR_OUTPUT").contains(section)) {
            throw new IllegalArgumentException("unsupported section " + section);
        }
        while (!peek().equals("END_VAR")) {
            String name = identifier();
            expect(":");
            String type = next();
            if (!TYPES.contains(type)) {
                throw new IllegalArgumentException("unsupported type " + type);
            }
            Object initial = type.equals("BOOL") ? Boolean.FALSE : Double.valueOf(0.0);
            if (peek().equals(":=")) {
                next();
                initial = literal(type);
            } else if (constant) {
                throw new IllegalArgumentException("constant without value: " + name);
            }
            expect(";");
            if (types.put(name, type) != null) {
                throw new IllegalArgumentException("declared twice: " + name);
            }
            values.put(name, initial);
            if (constant) {
                constants.add(name);
            }
            if (section.equals("VAR_INPUT")) {
                inputs.add(name);
            }
        }
        expect("END_VAR");
    }

    private Object literal(String type) {
        String t = next();
        boolean negative = false;
        if (t.equals("-")) {
            negative = true;
            t = next();
        }
        if (type.equals("BOOL")) {
            if (negative || !(t.equals("TRUE") || t.equals("FALSE"))) {
                throw new IllegalArgumentException("bad BOOL literal " + t);
            }
            return t.equals("TRUE");
        }
        double d = number(t);
        return negative ? -d : d;
    }

    private List<Stmt> statements(Set<String> terminators) {
        List<Stmt> list = new ArrayList<>();
        while (!terminators.contains(peek())) {
            list.add(statement());
        }
        return list;
    }

    private Stmt statement() {
        if (peek().equals("IF")) {
            next();
            List<Expr> conditions = new ArrayList<>();
            List<List<Stmt>> branches = new ArrayList<>();
            conditions.add(expression());
            expect("THEN");
            branches.add(statements(Set.of("ELSIF", "ELSE", "END_IF")));
            while (peek().equals("ELSIF")) {
                next();
                conditions.add(expression());
                expect("THEN");
                branches.add(statements(Set.of("ELSIF", "ELSE", "END_IF")));
            }
            List<Stmt> otherwise = List.of();
            if (peek().equals("ELSE")) {
                next();
                otherwise = statements(Set.of("END_IF"));
            }
            expect("END_IF");
            expect(";");
            List<Stmt> fallback = otherwise;
            return v -> {
                for (int i = 0; i < conditions.size(); i++) {
                    if (bool(conditions.get(i).eval(v))) {
                        branches.get(i).forEach(s -> s.run(v));
                        return;
                    }
                }
                fallback.forEach(s -> s.run(v));
            };
        }
        String target = identifier();
        if (!types.containsKey(target)) {
            throw new IllegalArgumentException("undeclared " + target);
        }
        if (constants.contains(target) || inputs.contains(target)) {
            throw new IllegalArgumentException("write to a constant or input: " + target);
        }
        expect(":=");
        Expr e = expression();
        expect(";");
        return v -> {
            Object value = e.eval(v);
            checkType(target, value);
            v.put(target, value);
        };
    }

    private Expr expression() {
        Expr left = and();
        while (peek().equals("OR")) {
            next();
            Expr l = left;
            Expr r = and();
            left = v -> bool(l.eval(v)) | bool(r.eval(v));
        }
        return left;
    }

    private Expr and() {
        Expr left = comparison();
        while (peek().equals("AND")) {
            next();
            Expr l = left;
            Expr r = comparison();
            left = v -> bool(l.eval(v)) & bool(r.eval(v));
        }
        return left;
    }

    private Expr comparison() {
        Expr left = additive();
        if (COMPARISONS.contains(peek())) {
            String op = next();
            Expr l = left;
            Expr r = additive();
            return v -> {
                double a = real(l.eval(v));
                double b = real(r.eval(v));
                switch (op) {
                    case "=":
                        return a == b;
                    case "<>":
                        return a != b;
                    case "<":
                        return a < b;
                    case ">":
                        return a > b;
                    case "<=":
                        return a <= b;
                    default:
                        return a >= b;
                }
            };
        }
        return left;
    }

    private Expr additive() {
        Expr left = multiplicative();
        while (peek().equals("+") || peek().equals("-")) {
            String op = next();
            Expr l = left;
            Expr r = multiplicative();
            left = op.equals("+") ? v -> real(l.eval(v)) + real(r.eval(v)) : v -> real(l.eval(v)) - real(r.eval(v));
        }
        return left;
    }

    private Expr multiplicative() {
        Expr left = unary();
        while (peek().equals("*") || peek().equals("/")) {
            String op = next();
            Expr l = left;
            Expr r = unary();
            left = op.equals("*") ? v -> real(l.eval(v)) * real(r.eval(v)) : v -> real(l.eval(v)) / real(r.eval(v));
        }
        return left;
    }

    private Expr unary() {
        if (peek().equals("-")) {
            next();
            Expr e = unary();
            return v -> -real(e.eval(v));
        }
        if (peek().equals("NOT")) {
            next();
            Expr e = unary();
            return v -> !bool(e.eval(v));
        }
        return primary();
    }

    private Expr primary() {
        String t = next();
        if (t.equals("(")) {
            Expr e = expression();
            expect(")");
            return e;
        }
        if (t.equals("TRUE") || t.equals("FALSE")) {
            boolean b = t.equals("TRUE");
            return v -> b;
        }
        if (Character.isDigit(t.charAt(0))) {
            double d = number(t);
            return v -> d;
        }
        if (!types.containsKey(t)) {
            throw new IllegalArgumentException("undeclared or unsupported: " + t);
        }
        if (peek().equals("(")) {
            throw new IllegalArgumentException("function calls are outside the subset: " + t);
        }
        return v -> read(v, t);
    }

    private static double number(String t) {
        if (!t.matches("[0-9]+\\.[0-9]+([eE][+-]?[0-9]+)?")) {
            throw new IllegalArgumentException("not an LREAL literal: " + t);
        }
        return Double.parseDouble(t);
    }

    private Object read(Map<String, Object> v, String name) {
        Object value = v.get(name);
        if (value == null) {
            throw new IllegalArgumentException("undeclared " + name);
        }
        return value;
    }

    private void checkType(String name, Object value) {
        String type = types.get(name);
        boolean ok = type != null && (type.equals("BOOL") ? value instanceof Boolean : value instanceof Double);
        if (!ok) {
            throw new IllegalArgumentException("type mismatch on " + name);
        }
    }

    private static boolean bool(Object o) {
        if (!(o instanceof Boolean)) {
            throw new IllegalArgumentException("BOOL expected");
        }
        return (Boolean) o;
    }

    private static double real(Object o) {
        if (!(o instanceof Double)) {
            throw new IllegalArgumentException("LREAL expected");
        }
        return (Double) o;
    }

    private String peek() {
        return pos < tokens.size() ? tokens.get(pos) : "<end>";
    }

    private String next() {
        String t = peek();
        pos++;
        return t;
    }

    private void expect(String token) {
        String t = next();
        if (!t.equals(token)) {
            throw new IllegalArgumentException("expected " + token + " but found " + t);
        }
    }

    private String identifier() {
        String t = next();
        if (!t.matches("[A-Za-z][A-Za-z0-9_]*")) {
            throw new IllegalArgumentException("identifier expected, found " + t);
        }
        return t;
    }

    private static List<String> tokenize(String s) {
        List<String> out = new ArrayList<>();
        int i = 0;
        while (i < s.length()) {
            if (out.size() > MAX_TOKENS) {
                throw new IllegalArgumentException("too many tokens");
            }
            char c = s.charAt(i);
            if (Character.isWhitespace(c)) {
                i++;
            } else if (s.startsWith("(*", i)) {
                int end = s.indexOf("*)", i + 2);
                if (end < 0) {
                    throw new IllegalArgumentException("unterminated comment");
                }
                i = end + 2;
            } else if (Character.isLetter(c)) {
                int j = i;
                while (j < s.length() && (Character.isLetterOrDigit(s.charAt(j)) || s.charAt(j) == '_')) {
                    j++;
                }
                out.add(s.substring(i, j));
                i = j;
            } else if (Character.isDigit(c)) {
                int j = i;
                while (j < s.length()
                        && (Character.isDigit(s.charAt(j))
                                || s.charAt(j) == '.'
                                || s.charAt(j) == 'E'
                                || s.charAt(j) == 'e'
                                || ((s.charAt(j) == '-' || s.charAt(j) == '+')
                                        && (s.charAt(j - 1) == 'E' || s.charAt(j - 1) == 'e')))) {
                    j++;
                }
                out.add(s.substring(i, j));
                i = j;
            } else if (s.startsWith(":=", i)
                    || s.startsWith("<=", i)
                    || s.startsWith(">=", i)
                    || s.startsWith("<>", i)) {
                out.add(s.substring(i, i + 2));
                i += 2;
            } else if ("+-*/()<>=;:".indexOf(c) >= 0) {
                out.add(String.valueOf(c));
                i++;
            } else {
                throw new IllegalArgumentException("character outside the subset: '" + c + "'");
            }
        }
        return out;
    }
}
