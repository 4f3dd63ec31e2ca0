#!/usr/bin/env python3
"""Validates a toehold results.json against the JSON Schema in docs/results-schema.md (the first ```json block
after the heading "## JSON Schema"), with a small validator of our own for the keywords that schema uses:
type, properties, required, additionalProperties, items, minItems, maxItems, enum, const, minimum, maximum,
pattern, anyOf, $ref (to #/$defs/...). Standard library only.

    report_schema_check.py results.json docs/results-schema.md
Exit code 0 when the file validates; 1 with one line per problem otherwise."""
import json
import re
import sys

TYPES = {
    'object': lambda v: isinstance(v, dict),
    'array': lambda v: isinstance(v, list),
    'string': lambda v: isinstance(v, str),
    'number': lambda v: isinstance(v, (int, float)) and not isinstance(v, bool),
    'integer': lambda v: isinstance(v, int) and not isinstance(v, bool),
    'boolean': lambda v: isinstance(v, bool),
    'null': lambda v: v is None,
}
KNOWN = {'type', 'properties', 'required', 'additionalProperties', 'items', 'minItems', 'maxItems', 'enum',
         'const', 'minimum', 'maximum', 'pattern', 'anyOf', '$ref', '$defs', '$schema', '$id', 'title',
         'description'}


def schema_from_markdown(path):
    text = open(path, encoding='utf-8').read()
    at = text.find('## JSON Schema')
    if at < 0:
        raise SystemExit('%s: no "## JSON Schema" heading' % path)
    match = re.search(r'```json\n(.*?)\n```', text[at:], re.S)
    if not match:
        raise SystemExit('%s: no ```json block after "## JSON Schema"' % path)
    return json.loads(match.group(1))


class Validator:
    def __init__(self, root):
        self.root = root
        self.problems = []

    def resolve(self, ref):
        if not ref.startswith('#/$defs/'):
            raise SystemExit('unsupported $ref %s' % ref)
        return self.root['$defs'][ref[len('#/$defs/'):]]

    def fail(self, where, what):
        self.problems.append('%s: %s' % (where or '(top)', what))

    def valid(self, value, schema, where):
        """True when value matches schema; problems are recorded only by check()."""
        saved = self.problems
        self.problems = []
        self.check(value, schema, where)
        ok = not self.problems
        self.problems = saved
        return ok

    def check(self, value, schema, where=''):
        unknown = set(schema) - KNOWN
        if unknown:
            raise SystemExit('schema keyword(s) %s at %s not supported by this checker' % (sorted(unknown), where))
        if '$ref' in schema:
            self.check(value, self.resolve(schema['$ref']), where)
        if 'type' in schema:
            types = schema['type'] if isinstance(schema['type'], list) else [schema['type']]
            if not any(TYPES[t](value) for t in types):
                self.fail(where, 'expected %s, found %r' % (' or '.join(types), value))
                return
        if 'const' in schema and value != schema['const']:
            self.fail(where, 'expected %r, found %r' % (schema['const'], value))
        if 'enum' in schema and value not in schema['enum']:
            self.fail(where, '%r is not one of %r' % (value, schema['enum']))
        if TYPES['number'](value):
            if 'minimum' in schema and value < schema['minimum']:
                self.fail(where, '%r is below the minimum %r' % (value, schema['minimum']))
            if 'maximum' in schema and value > schema['maximum']:
                self.fail(where, '%r is above the maximum %r' % (value, schema['maximum']))
        if isinstance(value, str) and 'pattern' in schema and not re.search(schema['pattern'], value):
            self.fail(where, '%r does not match %r' % (value, schema['pattern']))
        if 'anyOf' in schema and not any(self.valid(value, s, where) for s in schema['anyOf']):
            self.fail(where, '%r matches none of the allowed forms' % (value,))
        if isinstance(value, dict):
            self.check_object(value, schema, where)
        if isinstance(value, list):
            self.check_array(value, schema, where)

    def check_object(self, value, schema, where):
        for key in schema.get('required', []):
            if key not in value:
                self.fail(where, 'missing key "%s"' % key)
        properties = schema.get('properties', {})
        for key, item in value.items():
            if key in properties:
                self.check(item, properties[key], where + '.' + key)
            elif schema.get('additionalProperties', True) is False:
                self.fail(where, 'key "%s" is not in the schema' % key)

    def check_array(self, value, schema, where):
        if 'minItems' in schema and len(value) < schema['minItems']:
            self.fail(where, '%d items, at least %d expected' % (len(value), schema['minItems']))
        if 'maxItems' in schema and len(value) > schema['maxItems']:
            self.fail(where, '%d items, at most %d expected' % (len(value), schema['maxItems']))
        if 'items' in schema:
            for i, item in enumerate(value):
                self.check(item, schema['items'], '%s[%d]' % (where, i))


def main():
    if len(sys.argv) != 3:
        raise SystemExit(__doc__)
    def reject(name):
        raise SystemExit('%s holds %s, which is not JSON' % (sys.argv[1], name))
    with open(sys.argv[1], encoding='utf-8') as f:
        document = json.load(f, parse_constant=reject)
    schema = schema_from_markdown(sys.argv[2])
    validator = Validator(schema)
    validator.check(document, schema)
    for problem in validator.problems[:50]:
        print('schema: ' + problem)
    if validator.problems:
        print('%s does not validate against %s (%d problems)' % (sys.argv[1], sys.argv[2], len(validator.problems)))
        return 1
    print('%s validates against the schema in %s' % (sys.argv[1], sys.argv[2]))
    return 0


if __name__ == '__main__':
    sys.exit(main())
