#!/usr/bin/env python3
"""Refreshes the response examples of openapi.yaml from the started service's answers.

After a change of a response (a new member, a new operation's example), ContractExamplesTest fails until the
examples are the live answers again. This writes them:

    mvn -B -o -q -pl service -am test -Dtest=ContractExamplesTest -Dsurefire.failIfNoSpecifiedTests=false \
        -Dloopwright.examples.write=/tmp/loopwright-examples
    python3 service/refresh-contract-examples.py /tmp/loopwright-examples

Each `value:` of a 200 example (under paths) and of a problem example (under components/examples) whose live
answer was written is replaced in place; everything else in openapi.yaml is left as it is. A new operation needs
an example entry first (any value, e.g. `value: {}`), named after its request example. JSON is written as YAML
flow (objects one member a line, arrays of numbers on one line); text as a literal block; the Prometheus text, the
contract and the page as the excerpts the test compares (a few families, the first lines). The service version in
answers is written as the contract's info.version, a request id as one made from the example's name. ServiceOverloadedProblem is not provoked by the test and is
kept.
"""
import json
import re
import sys
import uuid
from pathlib import Path

CONTRACT = Path(__file__).resolve().parent.parent / "openapi.yaml"


def flow(node, indent):
    """JSON as YAML flow: objects one member a line, arrays of scalars (or of arrays of scalars) on one line."""
    pad = " " * indent
    if isinstance(node, dict):
        if not node:
            return "{}"
        items = [pad + "  " + json.dumps(k) + ": " + flow(v, indent + 2) for k, v in node.items()]
        return "{\n" + ",\n".join(items) + "\n" + pad + "}"
    if isinstance(node, list):
        scalar = lambda v: not isinstance(v, (dict, list))
        if all(scalar(v) or (isinstance(v, list) and all(scalar(x) for x in v)) for v in node):
            return json.dumps(node)
        return "[\n" + ",\n".join(pad + "  " + flow(v, indent + 2) for v in node) + "\n" + pad + "]"
    return json.dumps(node)


def excerpt(path, text):
    lines = text.split("\n")
    if path == "/metrics":
        keep = []
        for family in ("loopwright_build_info", "loopwright_http_requests_total"):
            keep += [l for l in lines if l.startswith(("# HELP " + family + " ", "# TYPE " + family + " "))]
            keep += [l for l in lines if l.startswith(family + "{")][:3]
        return "\n".join(keep)
    if path == "/openapi.yaml":
        return "\n".join(lines[:4])
    if path == "/":
        return "\n".join(lines[:2])
    return text


def value_lines(indent, media, path, text, version):
    text = re.sub(r'"serviceVersion":"[^"]*"', '"serviceVersion":"%s"' % version, text)
    text = re.sub(r"Loopwright [0-9][^ \n]*", "Loopwright " + version, text)
    text = re.sub(r'version="[^"]*"', 'version="%s"' % version, text)
    if media.endswith("json") and media != "application/x-ndjson":
        return [" " * indent + "value: " + flow(json.loads(text), indent)]
    out = [" " * indent + "value: |-"]
    for line in excerpt(path, text).rstrip("\n").split("\n"):
        out.append(" " * (indent + 2) + line if line else "")
    return out


def main(directory, contract=CONTRACT):
    answers = Path(directory)
    lines = contract.read_text().split("\n")
    version = re.search(r"^  version: (\S+)$", "\n".join(lines), re.M).group(1)
    indent_of = lambda l: len(l) - len(l.lstrip())
    out, path, method, status, media, example, in_components = [], None, None, None, None, None, False
    i, replaced = 0, 0
    while i < len(lines):
        line = lines[i]
        if re.match(r"^  /\S*:$", line):
            path, in_components = line.strip()[:-1], False
        elif line == "components:":
            path, in_components = None, True
        elif re.match(r"^    (get|post|put|delete):$", line) and path:
            method = line.strip()[:-1]
        elif re.match(r"^        '\d{3}':$", line) and path:
            status = line.strip()[1:4]
        elif re.match(r"^            [a-z]+/[a-z0-9.+-]+:$", line) and path:
            media = line.strip()[:-1]
        elif re.match(r"^                \w+:$", line) and path:
            example = line.strip()[:-1]
        elif re.match(r"^    \w+Problem:$", line) and in_components:
            example = line.strip()[:-1]
        if line.lstrip().startswith("value:"):
            indent = indent_of(line)
            end = i + 1
            while end < len(lines) and (not lines[end].strip() or indent_of(lines[end]) > indent):
                end += 1
            if end < len(lines) and lines[end].strip() in ("}", "]") and indent_of(lines[end]) == indent:
                end += 1  # the closing bracket of a flow value written at the key's indent
            if path and status == "200" and indent == 18:
                where = "%s %s %s %s" % (method, path, media, example)
                answer = answers / (re.sub(r"[^A-Za-z0-9.-]+", "_", where) + ".txt")
            elif in_components and indent == 6:
                answer = answers / ("problem_" + example + ".txt")
            else:
                answer = None
            if answer is not None and answer.exists():
                text = answer.read_text()
                # a request id made from the example's name, so that a refresh changes no id
                text = re.sub(r'"/requests/[0-9a-f-]{36}', '"/requests/' + str(uuid.uuid5(uuid.NAMESPACE_URL, example)), text)
                out += value_lines(indent, media if path else "application/json", path, text, version)
                replaced += 1
                i = end
                continue
        out.append(line)
        i += 1
    contract.write_text("\n".join(out))
    print("replaced %d example values in %s" % (replaced, contract))


if __name__ == "__main__":
    main(sys.argv[1], Path(sys.argv[2]) if len(sys.argv) > 2 else CONTRACT)
