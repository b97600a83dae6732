// Every intent of the contract, in both hosts, refuses what it does not take before
// its handler runs: another type than an object, an unexpected field (the way a page
// would try to pass a path), and a huge value in that field. Each intent's own tests
// cover its fields; this keeps the whole list honest as intents are added.
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { INTENT_NAMES } from '../../electron/api-contract.ts';
import { HandlerError } from '../../electron/handler-error.ts';
import { browserHostFixture, desktopHostFixture, SECRET_TEXT } from './project-host-fixture.ts';

/** A value far beyond any field's limit: 16 MiB of text (the field is refused by name before its size matters). */
const HUGE_TEXT_LENGTH = 16 * 2 ** 20;

describe('every intent, in both hosts', () => {
  const hosts = { browser: browserHostFixture(), desktop: desktopHostFixture({ open: [], save: [], scan: [] }) };

  for (const [hostName, host] of Object.entries(hosts)) {
    it(`${hostName}: refuses a path slipped in as an extra field, huge or not, and arguments that are not an object`, async () => {
      const huge = 'x'.repeat(HUGE_TEXT_LENGTH);
      for (const intent of INTENT_NAMES) {
        for (const args of [{ path: host.secret }, { path: huge }, 'text', 42, [host.secret]]) {
          const error = await host.call(intent, args).then(() => null, (e: unknown) => e);
          expect(error, `${intent} ${JSON.stringify(args).slice(0, 40)}`).toBeInstanceOf(HandlerError);
          expect((error as HandlerError).kind, intent).toBe('bad-arguments');
          expect((error as HandlerError).message.length, intent).toBeLessThan(600); // the message never echoes the huge value
        }
      }
      expect(readFileSync(host.secret, 'utf8')).toBe(SECRET_TEXT);
      expect(readdirSync(host.workspace)).toEqual([]);
    });
  }
});
