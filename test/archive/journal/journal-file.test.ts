import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { journalFileName, parseJournalFileName, readJournal, serializeEvent } from '../../../src-renderer/archive/journal/journal-file';
import { sha256OfText } from '../../../src-renderer/archive/journal/sha256';
import { movePick, setUpField, Team } from './team-fixture';

// Synthetic journals: the events and the damage done to them are set by each test.

function annaJournal(count = 6) {
  const team = new Team();
  const anna = team.person('Anna', 'laptop-7');
  setUpField(anna);
  for (let i = 0; i < count - 3; i++) movePick(anna, 't1', 1, 'closure', 31e6 + i * 1e4);
  const file = journalFileName('Anna', 'laptop-7');
  const lines = anna.own.map(serializeEvent);
  return { anna, file, lines, text: lines.map((l) => l + '\n').join('') };
}

describe('journal file', () => {
  it('should chain each event to the SHA-256 of the line before it', () => {
    const { lines, anna } = annaJournal();
    expect(anna.own[0].prev).toBe('');
    for (let i = 1; i < lines.length; i++) expect(anna.own[i].prev).toBe(sha256OfText(lines[i - 1]));
    expect(anna.own.map((e) => e.seq)).toEqual([1, 2, 3, 4, 5, 6]);
  });

  it('should read an intact journal with no issues', () => {
    const { file, text, anna } = annaJournal();
    const read = readJournal(file, text);
    expect(read.issues).toEqual([]);
    expect(read.events).toEqual(anna.own);
    expect(read.goodLength).toBe(text.length);
  });

  it('should skip a torn last line and keep every event before it', () => {
    const { file, text, lines, anna } = annaJournal();
    const torn = text + lines[2].slice(0, 40); // a write cut short by a crash
    const read = readJournal(file, torn);
    expect(read.events).toEqual(anna.own);
    expect(read.issues).toHaveLength(1);
    expect(read.issues[0]).toMatchObject({ kind: 'torn-tail', file, line: 7 });
    expect(read.goodLength).toBe(text.length);
  });

  it('should skip a corrupt tail of several lines, keeping the events before it', () => {
    const { file, lines, anna } = annaJournal();
    const damaged = lines.slice(0, 4).join('\n') + '\n' + '\u0000\u0000\u0000garbage\n{"id":\n';
    const read = readJournal(file, damaged);
    expect(read.events).toEqual(anna.own.slice(0, 4));
    expect(read.issues.map((i) => [i.kind, i.line])).toEqual([['corrupt-tail', 5], ['corrupt-tail', 6]]);
  });

  it('should flag a line edited behind the app\'s back, naming the line, and keep all events', () => {
    const { file, lines } = annaJournal();
    const edited = [...lines];
    edited[3] = edited[3].replace('31000000', '29000000'); // someone lowered a closure pick by hand
    expect(edited[3]).not.toBe(lines[3]);
    const read = readJournal(file, edited.map((l) => l + '\n').join(''));
    expect(read.events).toHaveLength(6);
    expect(read.issues.map((i) => [i.kind, i.line])).toEqual([['chain-broken', 5]]);
    expect(read.issues[0].message).toContain('line 4 was changed');
  });

  it('should flag a removed line as a broken chain and a numbering gap', () => {
    const { file, lines } = annaJournal();
    const removed = [...lines.slice(0, 2), ...lines.slice(3)];
    const read = readJournal(file, removed.map((l) => l + '\n').join(''));
    expect(read.events).toHaveLength(5);
    expect(read.issues.map((i) => i.kind).sort()).toEqual(['chain-broken', 'sequence-gap']);
  });

  it('should report a corrupt line in the middle and keep reading after it', () => {
    const { file, lines } = annaJournal();
    const damaged = [...lines];
    damaged[2] = damaged[2].slice(0, 30) + '#' + damaged[2].slice(31);
    const read = readJournal(file, damaged.map((l) => l + '\n').join(''));
    expect(read.events).toHaveLength(5);
    expect(read.issues.map((i) => [i.kind, i.line])).toEqual([['corrupt-line', 3], ['chain-broken', 4], ['sequence-gap', 4]]);
  });

  it('should say which field of a line is not an event', () => {
    const { file, lines } = annaJournal();
    const wrongKind = lines[0].replace('"field-created"', '"field-renamed"');
    const wrongNumber = lines[3].replace(/"cycle":1/, '"cycle":"one"');
    const read = readJournal(file, [wrongKind, ...lines.slice(1, 3), wrongNumber, ...lines.slice(4)].join('\n') + '\n');
    const corrupt = read.issues.filter((i) => i.kind === 'corrupt-line');
    expect(corrupt.map((i) => i.line)).toEqual([1, 4]);
    expect(corrupt[0].message).toContain('body.kind: expected one of');
    expect(corrupt[1].message).toContain('body.cycle: expected number');
    expect(read.events).toHaveLength(4);
  });

  it('should flag an event of another user inside a journal', () => {
    const { text } = annaJournal();
    const read = readJournal(journalFileName('Ben', 'desk-2'), text);
    expect(read.issues.filter((i) => i.kind === 'wrong-journal')).toHaveLength(6);
  });

  it('should keep a whole last event that lacks its newline, and say so', () => {
    const { file, text } = annaJournal();
    const read = readJournal(file, text.slice(0, -1));
    expect(read.events).toHaveLength(6);
    expect(read.issues.map((i) => i.kind)).toEqual(['missing-newline']);
  });

  it('should read appended lines from a cursor with the same result as a whole read', () => {
    const { file, lines, text } = annaJournal();
    const firstPart = lines.slice(0, 3).map((l) => l + '\n').join('');
    const first = readJournal(file, firstPart);
    const rest = readJournal(file, text.slice(firstPart.length), first.cursor);
    expect(rest.issues).toEqual([]);
    expect([...first.events, ...rest.events]).toEqual(readJournal(file, text).events);
    expect(rest.lines[0]).toBe(4);
  });

  it('should name journal files safely and read the names back', () => {
    expect(journalFileName('Anna Berg', 'laptop-7')).toBe('Anna%20Berg@laptop-7.jsonl');
    expect(journalFileName('Zoë@site', 'rig/1')).toBe('Zo%C3%AB%40site@rig%2F1.jsonl');
    expect(parseJournalFileName('Zo%C3%AB%40site@rig%2F1.jsonl')).toEqual({ author: 'Zoë@site', device: 'rig/1' });
    expect(parseJournalFileName('notes.txt')).toBeNull();
  });

  it('should keep exactly the whole lines before a cut at any byte (property)', () => {
    const { file, text, lines, anna } = annaJournal(8);
    fc.assert(fc.property(fc.integer({ min: 0, max: text.length }), (cut) => {
      const read = readJournal(file, text.slice(0, cut));
      const ends = lines.map((_, i) => lines.slice(0, i + 1).join('\n').length); // end of line i, before its newline
      const whole = ends.filter((end) => end < cut).length; // lines with their newline inside the cut
      const exactlyAtEnd = ends.includes(cut); // cut just before a newline: the event is whole
      expect(read.events).toEqual(anna.own.slice(0, whole + (exactlyAtEnd ? 1 : 0)));
      const kinds = read.issues.map((i) => i.kind);
      if (exactlyAtEnd) expect(kinds).toEqual(['missing-newline']);
      else if (ends.some((end, i) => cut > (i === 0 ? 0 : ends[i - 1] + 1) && cut < end)) expect(kinds).toEqual(['torn-tail']);
      else expect(kinds).toEqual([]);
    }), { numRuns: 300 });
  });

  it('should flag any changed character in the middle and keep every other event (property)', () => {
    const { file, lines, anna } = annaJournal(8);
    const middle = lines.slice(0, 7).join('\n').length; // damage anywhere before the last line
    fc.assert(fc.property(fc.integer({ min: 0, max: middle - 1 }), fc.constantFrom('#', '0', 'x', ' '), (at, ch) => {
      const text = lines.join('\n') + '\n';
      if (text[at] === ch || text[at] === '\n') return;
      const damaged = text.slice(0, at) + ch + text.slice(at + 1);
      const read = readJournal(file, damaged);
      const damagedLine = text.slice(0, at).split('\n').length; // 1-based
      expect(read.issues.length).toBeGreaterThan(0);
      expect(read.issues.some((i) => (i.kind === 'chain-broken' && i.line === damagedLine + 1) || (i.kind === 'corrupt-line' && i.line === damagedLine))).toBe(true);
      const untouched = anna.own.filter((_, i) => i !== damagedLine - 1);
      for (const e of untouched) expect(read.events).toContainEqual(e);
    }), { numRuns: 300 });
  });
});
