#!/usr/bin/env python3
"""Checks a toehold results folder's report.html against its results.json and the inputs, standard library only:
  - the report has a section for every toe of the plan and a table row for every station of the JSON;
  - every number in the station tables equals the JSON's value to the digits shown;
  - the provenance hashes (JSON and report) equal sha256sum's of the input files, and the plan is verbatim.

    report_check.py <results folder> <plan.toml>
Exit code 0 when all checks pass; 1 with one line per problem otherwise."""
import html.parser
import json
import math
import os
import re
import subprocess
import sys
import tomllib


class Report(html.parser.HTMLParser):
    """Collects the station rows (id -> {cell class -> text}), the toe headings, the input table and the plan."""

    def __init__(self):
        super().__init__(convert_charrefs=True)
        self.rows, self.headings, self.inputs, self.plan_text = {}, [], [], None
        self._row = self._cell = self._heading = None
        self._in_inputs = self._in_pre = False
        self._input_row = None
        self._text = []

    def handle_starttag(self, tag, attrs):
        a = dict(attrs)
        if tag == 'tr' and a.get('id', '').startswith('toe-'):
            self._row = self.rows.setdefault(a['id'], {})
        if tag == 'td' and self._row is not None:
            classes = [c for c in a.get('class', '').split() if c.startswith('v-')]
            self._cell = classes[0][2:] if classes else None
            self._text = []
        if tag == 'h2' and a.get('id', '').startswith('toe-'):
            self._heading, self._text = a['id'], []
        if tag == 'table' and a.get('id') == 'inputs':
            self._in_inputs = True
        if self._in_inputs and tag == 'tr':
            self._input_row = []
        if self._in_inputs and tag == 'td':
            self._text = []
        if tag == 'pre' and a.get('id') == 'plan-text':
            self._in_pre, self._text = True, []

    def handle_endtag(self, tag):
        text = ''.join(self._text)
        if tag == 'td' and self._row is not None and self._cell:
            self._row[self._cell] = text.strip()
            self._cell = None
        if tag == 'tr':
            self._row = None
            if self._in_inputs and self._input_row:
                self.inputs.append(self._input_row)
            self._input_row = None
        if tag == 'td' and self._in_inputs and self._input_row is not None:
            self._input_row.append(text.strip())
        if tag == 'table':
            self._in_inputs = False
        if tag == 'h2' and self._heading:
            self.headings.append(text.strip())
            self._heading = None
        if tag == 'pre' and self._in_pre:
            self.plan_text, self._in_pre = text, False

    def handle_data(self, data):
        self._text.append(data)


def shown_tolerance(text):
    """Half a unit in the last digit shown: '150.8' -> 0.05, '3.28e+05' -> 500, '12' -> 0.5."""
    mantissa, _, exponent = text.lower().partition('e')
    decimals = len(mantissa.partition('.')[2])
    return 0.5 * 10.0 ** (-decimals) * 10.0 ** (int(exponent) if exponent else 0)


def same_number(text, value):
    if value is None:
        return text == '-'
    if value == 'infinite':
        return text == 'no damage'
    try:
        shown = float(text)
    except ValueError:
        return False
    return abs(shown - value) <= shown_tolerance(text) * (1 + 1e-9) + 1e-12 * abs(value)


def sha256sum(path):
    out = subprocess.run(['sha256sum', path], check=True, capture_output=True, text=True).stdout
    return out.split()[0]


def check_stations(doc, report, problems):
    expected_ids = set()
    for toe in doc['toes']:
        for s in toe['stations']:
            anchor = 'toe-%d-station-%d' % (toe['number'], s['id'])
            expected_ids.add(anchor)
            row = report.rows.get(anchor)
            if row is None:
                problems.append('report lacks the row of %s' % anchor)
                continue
            values = {'id': s['id'], 'x': s['position'][0], 'y': s['position'][1], 'z': s['position'][2],
                      'arc': s['arc_length']}
            r = s['result']
            if r is not None:
                values.update({'range': r['range'], 'allowable': r['allowable'], 'utilization': r['utilization']})
                for k, v in enumerate(r['hot_spot']):
                    values['hot-spot-%d' % k] = v
                if 'damage' in r:
                    values.update({'damage': r['damage'], 'equivalent-range': r['equivalent_range'],
                                   'life-repeats': r['life_repeats'], 'life-years': r['life_years']})
                else:
                    values['life'] = r['life_cycles']
            for name, value in values.items():
                if name not in row:
                    problems.append('%s: report row has no %s cell' % (anchor, name))
                elif not same_number(row[name], value):
                    problems.append('%s: report shows %s = %s, JSON has %r' % (anchor, name, row[name], value))
            if not row.get('status', '').startswith(s['status']):
                problems.append('%s: report status %r, JSON %r' % (anchor, row.get('status'), s['status']))
    extra = set(report.rows) - expected_ids
    if extra:
        problems.append('report rows not in the JSON: %s' % sorted(extra)[:5])
    return len(expected_ids)


def check_plan_toes(doc, report, plan_path, problems):
    with open(plan_path, 'rb') as f:
        plan = tomllib.load(f)
    names = [t['name'] for t in plan.get('toe', [])]
    if [t['name'] for t in doc['toes']] != names:
        problems.append('JSON toes %r, plan toes %r' % ([t['name'] for t in doc['toes']], names))
    for i, name in enumerate(names):
        heading = 'Toe %d: %s' % (i + 1, name)
        if heading not in report.headings:
            problems.append('report lacks the section "%s" (has %r)' % (heading, report.headings))
    return names


def check_provenance(doc, report, plan_path, problems):
    p = doc['provenance']
    plan_text = open(plan_path, encoding='utf-8').read()
    if p['plan_text'] != plan_text:
        problems.append('JSON plan_text is not the plan verbatim')
    if report.plan_text != plan_text:
        problems.append('report plan text is not the plan verbatim')
    shown = {row[1]: row for row in report.inputs if len(row) == 4}
    for f in p['files']:
        digest, size = sha256sum(f['path']), os.path.getsize(f['path'])
        if f['sha256'] != digest or f['size_bytes'] != size:
            problems.append('JSON has %s %s %s bytes, sha256sum says %s %d bytes'
                            % (f['path'], f['sha256'], f['size_bytes'], digest, size))
        row = shown.get(f['path'])
        if row is None or row[3] != digest or row[2] != str(size):
            problems.append('report input table for %s is %r, sha256sum says %s %d bytes' % (f['path'], row, digest, size))
    if not any(f['role'] == 'plan' and os.path.samefile(f['path'], plan_path) for f in p['files']):
        problems.append('provenance lacks the plan file')
    return len(p['files'])


def main():
    if len(sys.argv) != 3:
        raise SystemExit(__doc__)
    folder, plan_path = sys.argv[1], sys.argv[2]
    with open(os.path.join(folder, 'results.json'), encoding='utf-8') as f:
        doc = json.load(f)
    report = Report()
    with open(os.path.join(folder, 'report.html'), encoding='utf-8') as f:
        text = f.read()
    report.feed(text)
    problems = []
    if re.search(r'<script|https?://|<link|<img', text, re.I):
        problems.append('report.html has a script, link, image or web address; it must stand alone')
    names = check_plan_toes(doc, report, plan_path, problems)
    stations = check_stations(doc, report, problems)
    files = check_provenance(doc, report, plan_path, problems)
    for line in problems[:40]:
        print('report: ' + line)
    if problems:
        print('%d problems' % len(problems))
        return 1
    print('report.html: %d toes, %d stations, numbers equal results.json; %d input hashes match sha256sum'
          % (len(names), stations, files))
    return 0


if __name__ == '__main__':
    sys.exit(main())
