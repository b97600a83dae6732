// The proof font: the font built by the host from the project in the window, loaded
// into the page through the CSS Font Loading API. Each build is loaded under a family
// name of its own, so no cache can ever show an earlier build; the previous face is
// removed once the new one is in use. Rebuilds wait for a short pause in editing
// (PROOF_REBUILD_DELAY_MS), one build runs at a time and an edit made during a build
// starts one more when it ends, so the proof always ends on the latest state. The
// host's message is kept when a build fails, and the last good build stays shown.
import { tick } from 'svelte';
import { host, HostError } from '../host-api.ts';
import type { FontContent } from '../../../electron/api-contract.ts';

/**
 * Quiet time after the last edit before the font is rebuilt: 250 ms, longer than the
 * gaps between a drag's pointer moves or repeated key presses (tens of ms), so a drag
 * makes one build rather than dozens, and short enough that, with the host's build
 * (milliseconds for an alphabet) and the browser's load, the proof follows an edit
 * well within a second. Chosen here.
 */
export const PROOF_REBUILD_DELAY_MS = 250;

export type ProofPhase = 'waiting' | 'building' | 'ready' | 'failed';

/** Standard base64 to bytes. */
function bytesOf(base64: string): Uint8Array<ArrayBuffer> {
  const binary = atob(base64);
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
  return bytes;
}

function messageOf(error: unknown): string {
  return error instanceof HostError || error instanceof Error ? error.message : String(error);
}

export class ProofFont {
  /** The family name of the build shown, or null before the first build has loaded. */
  family = $state<string | null>(null);
  /** The characters the shown build maps. */
  characters = $state.raw<ReadonlySet<string>>(new Set());
  phase = $state<ProofPhase>('waiting');
  /** Why the latest build failed (the host's or the browser's message); null when it did not. */
  problem = $state<string | null>(null);
  /** Builds loaded so far. */
  loaded = $state(0);
  /** When the shown build finished loading. */
  loadedAt = $state<Date | null>(null);

  /** Distinguishes this window's families from any other page's. */
  private readonly prefix = `Stemline proof ${Math.random().toString(36).slice(2, 10)}`;
  private sequence = 0;
  private face: FontFace | null = null;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private running = false;
  private pending = false;
  private disposed = false;

  /** `content` gives the font to build from the window's state now; null when there is nothing to build. */
  constructor(private readonly content: () => FontContent | null) {}

  /** The project changed: rebuild after the pause. */
  changed(): void {
    this.cancelTimer();
    this.timer = setTimeout(() => {
      this.timer = null;
      void this.rebuild();
    }, PROOF_REBUILD_DELAY_MS);
  }

  /** Builds now (or as soon as the running build ends). */
  async rebuild(): Promise<void> {
    this.cancelTimer();
    if (this.running) {
      this.pending = true;
      return;
    }
    this.running = true;
    try {
      do {
        this.pending = false;
        await this.buildOnce();
      } while (this.pending && !this.disposed);
    } finally {
      this.running = false;
    }
  }

  private async buildOnce(): Promise<void> {
    const content = this.content();
    if (content === null || content.glyphs.length === 0) {
      this.phase = 'failed';
      this.problem = 'There are no letters to build a font from yet: fit the letters of a scan first.';
      return;
    }
    this.phase = 'building';
    try {
      const proof = await host.buildProofFont(content);
      if (this.disposed) return;
      const family = `${this.prefix} ${++this.sequence}`;
      const face = new FontFace(family, bytesOf(proof.base64));
      try {
        await face.load();
      } catch (error) {
        throw new Error(`The browser refused the font the host built (${messageOf(error)}). Please report this, with the project.`);
      }
      if (this.disposed) return;
      document.fonts.add(face);
      const previous = this.face;
      this.face = face;
      this.family = family;
      this.characters = new Set(proof.characters);
      this.loaded += 1;
      this.loadedAt = new Date();
      this.problem = null;
      this.phase = 'ready';
      // The page shows the new family once Svelte has updated it; only then is the old face dropped.
      await tick();
      if (previous) document.fonts.delete(previous);
    } catch (error) {
      if (this.disposed) return;
      this.phase = 'failed';
      this.problem = messageOf(error);
    }
  }

  private cancelTimer(): void {
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
  }

  /** Stops building and removes the loaded face from the page. */
  dispose(): void {
    this.disposed = true;
    this.cancelTimer();
    if (this.face) document.fonts.delete(this.face);
    this.face = null;
  }
}
