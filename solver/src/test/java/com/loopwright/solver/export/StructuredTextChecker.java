package com.loopwright.solver.export;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * A small grammar check of the IEC 61131-3 Structured Text subset the writer emits (our own, from the
 * standard's published syntax, from memory): closed (* *) comments; one FUNCTION_BLOCK ... END_FUNCTION_BLOCK;
 * VAR, VAR_INPUT, VAR_OUTPUT, VAR CONSTANT blocks closed by END_VAR with declarations "Name : TYPE [:= literal];";
 * IF/ELSIF/ELSE/END_IF; balanced; every statement ends with ';'; identifiers legal (letter or '_' first, no
 * double '_'), not keywords, and declared before use. Returns the list of violations (empty when clean).
 */
final class StructuredTextChecker {

    private static final Pattern IDENTIFIER = Pattern.compile("[A-Za-z_][A-Za-z0-9_]*");
    private static final Pattern DECLARATION = Pattern.compile(
            "([A-Za-z_][A-Za-z0-9_]*) : (BOOL|LREAL|REAL|INT|DINT)( := (-?[0-9]+\\.[0-9]+(E[+-]?[0-9]+)?|TRUE|FALSE))?;");
    private static final Pattern ASSIGNMENT = Pattern.compile("([A-Za-z_][A-Za-z0-9_]*) := (.+);");
    private static final Pattern TOKEN =
            Pattern.compile("\\s*([A-Za-z_][A-Za-z0-9_]*|[0-9]+\\.[0-9]+(E[+-]?[0-9]+)?|:=|<=|>=|<>|[-+*/()<>=])");
    private static final Set<String> KEYWORDS = Set.of(
            "FUNCTION_BLOCK",
            "END_FUNCTION_BLOCK",
            "VAR",
            "VAR_INPUT",
            "VAR_OUTPUT",
            "CONSTANT",
            "END_VAR",
            "IF",
            "THEN",
            "ELSIF",
            "ELSE",
            "END_IF",
            "TRUE",
            "FALSE",
            "AND",
            "OR",
            "NOT",
            "BOOL",
            "LREAL",
            "REAL",
            "INT",
            "DINT");

    List<String> check(String text) {
        List<String> problems = new ArrayList<>();
        String code = stripComments(text, problems);
        Deque<String> open = new ArrayDeque<>();
        Set<String> declared = new HashSet<>();
        int blocks = 0;
        String[] lines = code.split("\n");
        for (int n = 0; n < lines.length; n++) {
            String line = lines[n].trim();
            String where = "line " + (n + 1) + ": ";
            if (line.isEmpty()) {
                continue;
            }
            if (line.startsWith("FUNCTION_BLOCK ")) {
                blocks++;
                String name = line.substring("FUNCTION_BLOCK ".length());
                requireIdentifier(name, where, problems);
                if (!open.isEmpty()) {
                    problems.add(where + "nested FUNCTION_BLOCK");
                }
                open.push("FUNCTION_BLOCK");
            } else if (line.equals("END_FUNCTION_BLOCK")) {
                expect(open, "FUNCTION_BLOCK", where, problems);
            } else if (line.equals("VAR")
                    || line.equals("VAR_INPUT")
                    || line.equals("VAR_OUTPUT")
                    || line.equals("VAR CONSTANT")) {
                if (!"FUNCTION_BLOCK".equals(open.peek())) {
                    problems.add(where + line + " outside the block header");
                }
                open.push("VAR");
            } else if (line.equals("END_VAR")) {
                expect(open, "VAR", where, problems);
            } else if ("VAR".equals(open.peek())) {
                var m = DECLARATION.matcher(line);
                if (!m.matches()) {
                    problems.add(where + "not a declaration: " + line);
                } else {
                    requireIdentifier(m.group(1), where, problems);
                    if (!declared.add(m.group(1))) {
                        problems.add(where + "declared twice: " + m.group(1));
                    }
                }
            } else if (line.startsWith("IF ") || line.startsWith("ELSIF ")) {
                if (!line.endsWith(" THEN")) {
                    problems.add(where + "condition without THEN");
                } else {
                    String keyword = line.startsWith("IF ") ? "IF " : "ELSIF ";
                    checkExpression(line.substring(keyword.length(), line.length() - 5), declared, where, problems);
                }
                if (line.startsWith("IF ")) {
                    open.push("IF");
                } else if (!"IF".equals(open.peek())) {
                    problems.add(where + "ELSIF outside IF");
                }
            } else if (line.equals("ELSE")) {
                if (!"IF".equals(open.peek())) {
                    problems.add(where + "ELSE outside IF");
                }
            } else if (line.equals("END_IF;")) {
                expect(open, "IF", where, problems);
            } else {
                var m = ASSIGNMENT.matcher(line);
                if (!line.endsWith(";")) {
                    problems.add(where + "statement does not end with ';': " + line);
                } else if (!m.matches()) {
                    problems.add(where + "not an assignment: " + line);
                } else {
                    if (!declared.contains(m.group(1))) {
                        problems.add(where + "assignment to undeclared " + m.group(1));
                    }
                    checkExpression(m.group(2), declared, where, problems);
                }
                if (!"FUNCTION_BLOCK".equals(open.peek()) && !"IF".equals(open.peek())) {
                    problems.add(where + "statement outside the block body");
                }
            }
        }
        if (!open.isEmpty()) {
            problems.add("unclosed " + open);
        }
        if (blocks != 1) {
            problems.add("expected exactly one FUNCTION_BLOCK, found " + blocks);
        }
        return problems;
    }

    private static void checkExpression(String expression, Set<String> declared, String where, List<String> problems) {
        int depth = 0;
        int at = 0;
        var m = TOKEN.matcher(expression);
        while (at < expression.length()) {
            if (!m.find(at) || m.start() != at) {
                problems.add(where + "bad token in: " + expression.substring(at));
                return;
            }
            String token = m.group(1);
            if (token.equals("(")) {
                depth++;
            } else if (token.equals(")") && --depth < 0) {
                problems.add(where + "unbalanced ')'");
            } else if (IDENTIFIER.matcher(token).matches() && !KEYWORDS.contains(token) && !declared.contains(token)) {
                problems.add(where + "undeclared identifier " + token);
            }
            at = m.end();
        }
        if (depth != 0) {
            problems.add(where + "unbalanced '('");
        }
    }

    private static void requireIdentifier(String name, String where, List<String> problems) {
        if (!IDENTIFIER.matcher(name).matches()
                || name.contains("__")
                || name.endsWith("_")
                || KEYWORDS.contains(name.toUpperCase())) {
            problems.add(where + "illegal identifier " + name);
        }
    }

    private static void expect(Deque<String> open, String expected, String where, List<String> problems) {
        if (!expected.equals(open.peek())) {
            problems.add(where + "END of " + expected + " without its opening, open: " + open);
        } else {
            open.pop();
        }
    }

    /** Removes (* ... *) comments (not nested, as in the base standard), flags an unclosed one. */
    private static String stripComments(String text, List<String> problems) {
        StringBuilder out = new StringBuilder();
        int i = 0;
        while (i < text.length()) {
            int start = text.indexOf("(*", i);
            if (start < 0) {
                out.append(text, i, text.length());
                break;
            }
            out.append(text, i, start);
            int end = text.indexOf("*)", start + 2);
            if (end < 0) {
                problems.add("unclosed comment");
                break;
            }
            if (text.substring(start + 2, end).contains("(*")) {
                problems.add("nested comment opener inside a comment");
            }
            i = end + 2;
        }
        return out.toString();
    }
}
