// Exporting the test font: the font is built from the window's state at the moment
// the user asks and written by the host where they choose — the save dialog on the
// desktop, a file name in the workspace folder in the browser (asked for in the
// page's own chooser) — and the window says where it went, or the host's message.
import { host, HostError } from '../host-api.ts';
import type { FontContent, HostKind } from '../../../electron/api-contract.ts';

/** The page's chooser for the file name in browser mode. */
export interface FontExportRequest {
  /** The workspace folder's name, where the font will go. */
  readonly folderName: string;
  readonly suggestedName: string;
}

/** The font file name offered first: the family name, without characters a file name cannot hold. */
export function suggestedFontFileName(familyName: string): string {
  return `${familyName.replace(/[/\\:*?"<>|\u0000-\u001f]+/g, ' ').trim().replace(/^\.+/, '') || 'Untitled'}.otf`;
}

function messageOf(error: unknown): string {
  return error instanceof HostError || error instanceof Error ? error.message : String(error);
}

export class FontExport {
  busy = $state(false);
  problem = $state<string | null>(null);
  /** Where the last export went, for the user. */
  status = $state<string | null>(null);
  chooser = $state.raw<FontExportRequest | null>(null);

  constructor(private readonly content: () => FontContent | null, private readonly hostKind: () => HostKind | null) {}

  /** The user asked to export: the page's chooser in browser mode, the host's dialog otherwise. */
  async start(): Promise<void> {
    this.problem = null;
    const content = this.content();
    if (content === null || content.glyphs.length === 0) {
      this.problem = 'There are no letters to export yet: fit the letters of a scan first.';
      return;
    }
    if (this.hostKind() !== 'browser') return this.exportNamed(undefined);
    try {
      const listing = await host.listProjects({});
      if (listing.kind === 'workspace') this.chooser = { folderName: listing.folderName, suggestedName: suggestedFontFileName(content.font.familyName) };
      else await this.exportNamed(undefined);
    } catch (error) {
      this.problem = messageOf(error);
    }
  }

  /** Exports to `name` in the workspace (browser mode) or where the dialog answers (undefined). */
  async exportNamed(name: string | undefined): Promise<void> {
    this.chooser = null;
    const content = this.content();
    if (content === null) return;
    this.busy = true;
    this.problem = null;
    try {
      const written = await host.exportFont(name === undefined ? content : { ...content, name });
      if (written === null) return; // the user cancelled the dialog
      this.status = `Exported ${written.name} to ${written.path}${written.replaced ? ' (it replaced the file of that name)' : ''}`;
    } catch (error) {
      this.problem = `The font was not exported: ${messageOf(error)}`;
    } finally {
      this.busy = false;
    }
  }
}
