// Reading the user guide (docs/guide/) for the tests that hold it to the code: a
// chapter's text, the rows of a Markdown table found by its header, the code spans of
// a cell, and the shell words of an example command. Plain string handling, so a
// malformed table fails the test that reads it with a message saying what was expected.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The project's root folder. */
export const PROJECT_ROOT = fileURLToPath(new URL('../..', import.meta.url));

/** The text of a file of the project, by its path from the root. */
export function projectFile(path: string): string {
  return readFileSync(join(PROJECT_ROOT, path), 'utf8');
}

/** The text of a guide chapter, by its file name in docs/guide/. */
export function guideChapter(fileName: string): string {
  return projectFile(join('docs', 'guide', fileName));
}

/** The cells of one table line: split on unescaped pipes, `\|` kept as a pipe, trimmed. */
function cells(line: string): string[] {
  const inner = line.trim().replace(/^\|/, '').replace(/\|$/, '');
  return inner.split(/(?<!\\)\|/).map((cell) => cell.replace(/\\\|/g, '|').trim());
}

/**
 * The body rows of the first table whose header cells are exactly `header`, each as
 * its cells. Throws when there is no such table, or a row has another number of cells.
 */
export function tableRows(markdown: string, header: readonly string[]): string[][] {
  const lines = markdown.split('\n');
  const start = lines.findIndex((line) => line.trim().startsWith('|') && cells(line).join('\u0000') === header.join('\u0000'));
  if (start < 0) throw new Error(`no table with the header | ${header.join(' | ')} |`);
  const rows: string[][] = [];
  for (const line of lines.slice(start + 2)) {
    if (!line.trim().startsWith('|')) break;
    const row = cells(line);
    if (row.length !== header.length) throw new Error(`a row of the table | ${header.join(' | ')} | has ${row.length} cells: ${line}`);
    rows.push(row);
  }
  return rows;
}

/** The contents of the `code` spans in a cell, in order. */
export function codeSpans(cell: string): string[] {
  return [...cell.matchAll(/`([^`]+)`/g)].map((match) => match[1]!);
}

/** The lines of the fenced code blocks of one language in `markdown` (```sh; '' for blocks with none). */
export function fencedLines(markdown: string, language: string): string[] {
  const lines: string[] = [];
  let open: string | null = null;
  for (const line of markdown.split('\n')) {
    const fence = /^```(\S*)\s*$/.exec(line.trim());
    if (open === null && fence) open = fence[1]!;
    else if (open !== null && line.trim() === '```') open = null;
    else if (open === language) lines.push(line);
  }
  return lines;
}

/**
 * The words of a POSIX shell command line as the shell passes them on: whitespace
 * separates words; '…' is literal; "…" is literal except for \" and \\; a backslash
 * outside quotes takes the next character literally. Throws on an unclosed quote.
 */
export function shellWords(line: string): string[] {
  const words: string[] = [];
  let word: string | null = null;
  for (let i = 0; i < line.length; i++) {
    const c = line[i]!;
    if (c === "'") {
      const end = line.indexOf("'", i + 1);
      if (end < 0) throw new Error(`unclosed ' in: ${line}`);
      word = (word ?? '') + line.slice(i + 1, end);
      i = end;
    } else if (c === '"') {
      let text = '';
      let j = i + 1;
      for (; j < line.length && line[j] !== '"'; j++) {
        if (line[j] === '\\' && (line[j + 1] === '"' || line[j + 1] === '\\')) j++;
        text += line[j];
      }
      if (j >= line.length) throw new Error(`unclosed " in: ${line}`);
      word = (word ?? '') + text;
      i = j;
    } else if (c === '\\' && i + 1 < line.length) {
      word = (word ?? '') + line[i + 1];
      i++;
    } else if (/\s/.test(c)) {
      if (word !== null) words.push(word);
      word = null;
    } else {
      word = (word ?? '') + c;
    }
  }
  if (word !== null) words.push(word);
  return words;
}
