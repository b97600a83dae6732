// The progress line `stemline build` draws on a terminal: what it says at each point
// of a build, and that it is drawn in place, throttled, and cleared.
import { describe, expect, it } from 'vitest';
import { BAR_CELLS, formatProgress, progressFraction, terminalProgress } from '../../electron/cli/progress-bar.ts';

const start = { sheetCount: 4, sheetsTraced: 0, lettersFound: 0, lettersFitted: 0 };

describe('build progress line', () => {
  it('starts empty at 0 % and ends full at 100 %', () => {
    expect(formatProgress(start, 0)).toBe(`[${'░'.repeat(BAR_CELLS)}]   0%  sheets 0/4  letters 0/0  0:00`);
    const done = { sheetCount: 4, sheetsTraced: 4, lettersFound: 250, lettersFitted: 250 };
    expect(formatProgress(done, 75_000)).toBe(`[${'█'.repeat(BAR_CELLS)}] 100%  sheets 4/4  letters 250/250  1:15`);
  });

  it('counts tracing as half of each sheet and fitting its letters as the other half', () => {
    expect(progressFraction({ sheetCount: 2, sheetsTraced: 1, lettersFound: 60, lettersFitted: 0 })).toBeCloseTo(0.25, 12);
    expect(progressFraction({ sheetCount: 2, sheetsTraced: 1, lettersFound: 60, lettersFitted: 30 })).toBeCloseTo(0.375, 12);
    expect(progressFraction({ sheetCount: 2, sheetsTraced: 2, lettersFound: 120, lettersFitted: 60 })).toBeCloseTo(0.75, 12);
    expect(formatProgress({ sheetCount: 2, sheetsTraced: 2, lettersFound: 120, lettersFitted: 60 }, 1_500)).toBe(`[${'█'.repeat(18)}${'░'.repeat(6)}]  75%  sheets 2/2  letters 60/120  0:01`);
  });

  it('never runs backwards as letters are fitted and sheets traced', () => {
    let last = 0;
    for (let sheet = 1; sheet <= 3; sheet++) {
      for (let fitted = (sheet - 1) * 10; fitted <= sheet * 10; fitted++) {
        const fraction = progressFraction({ sheetCount: 3, sheetsTraced: sheet, lettersFound: sheet * 10, lettersFitted: fitted });
        expect(fraction).toBeGreaterThanOrEqual(last);
        last = fraction;
      }
    }
    expect(last).toBe(1);
  });

  it('redraws in place at most ten times a second, always draws the finished state, and erases itself', () => {
    const written: string[] = [];
    let now = 0;
    const display = terminalProgress((text) => written.push(text), () => now);
    display.show({ ...start, sheetsTraced: 1, lettersFound: 10 });
    now = 50;
    display.show({ ...start, sheetsTraced: 1, lettersFound: 10, lettersFitted: 1 });
    expect(written).toHaveLength(1);
    expect(written[0]).toMatch(/^\r\u001b\[K\[/);
    now = 60;
    display.show({ sheetCount: 4, sheetsTraced: 4, lettersFound: 10, lettersFitted: 10 });
    expect(written).toHaveLength(2);
    display.clear();
    expect(written[2]).toBe('\r\u001b[K');
    display.clear();
    expect(written).toHaveLength(3);
  });
});
