// The project behind the window: where it is kept (the host's handle for the file the
// user opened or saved, or the recovery place of a project never saved), whether it
// has unsaved changes, and the user's project commands — save, save as, open — with
// autosave after each pause in editing and the offer of recovered work. Every host
// write goes through one queue, so an autosave can never land after a save it
// preceded. Problems are kept with the host's message for the window to show.
import { host, HostError } from '../host-api.ts';
import type { HostKind, OpenedProject, ProjectHandle, ProjectListing, RecoveredWork } from '../../../electron/api-contract.ts';
import { AutosaveSchedule } from './autosave-schedule.ts';
import type { Workbench } from './workbench.svelte.ts';

/** The in-page chooser of browser mode: which command it serves and the workspace's projects. */
export interface ChooserRequest {
  readonly purpose: 'open' | 'save';
  readonly listing: Extract<ProjectListing, { kind: 'workspace' }>;
  /** The name offered for saving. */
  readonly suggestedName: string;
}

/** Recovered work the window offers to restore, and for which project. */
export interface RecoveryOffer {
  readonly work: RecoveredWork;
  /** The project just opened whose saved version is the alternative; null for work never saved. */
  readonly opened: OpenedProject | null;
}

function messageOf(error: unknown): string {
  return error instanceof HostError || error instanceof Error ? error.message : String(error);
}

function sameStamp(a: readonly unknown[], b: readonly unknown[]): boolean {
  return a.length === b.length && a.every((item, i) => item === b[i]);
}

export class ProjectSession {
  /** The project file's handle and name; null until the project is saved or opened. */
  handle = $state<ProjectHandle | null>(null);
  name = $state<string | null>(null);
  /** The stamp of the state last saved or opened (Workbench.stamp). */
  private savedStamp = $state.raw<readonly unknown[]>([]);
  /** The recovery place of a project never saved, once autosave has written it. */
  private untitledHandle: ProjectHandle | null = null;
  busy = $state<'saving' | 'opening' | null>(null);
  problem = $state<string | null>(null);
  /** What last happened, for the status line ("Saved harbour.stemline"). */
  status = $state('');
  chooser = $state.raw<ChooserRequest | null>(null);
  recovery = $state.raw<RecoveryOffer | null>(null);
  /** While the window shows (or is opening) the demo project: its title and story; null otherwise. */
  demo = $state.raw<{ title: string; description: string } | null>(null);
  private writes: Promise<unknown> = Promise.resolve();
  private readonly autosave = new AutosaveSchedule(() => void this.autosaveNow());

  constructor(
    private readonly workbench: Workbench,
    private readonly hostKind: () => HostKind | null,
    private readonly onRestored: () => void,
  ) {
    this.savedStamp = workbench.stamp;
  }

  /** Whether the window holds changes not saved to the project file. */
  get dirty(): boolean {
    return !sameStamp(this.workbench.stamp, this.savedStamp);
  }

  /** The project's title: its file name without the extension, the demo's title, or "Untitled project". */
  get title(): string {
    return this.name?.replace(/\.stemline$/i, '') ?? this.demo?.title ?? 'Untitled project';
  }

  /** Called whenever the workbench's stamp changes: schedules autosave while there are unsaved changes. */
  changed(): void {
    if (this.dirty) this.autosave.changed();
    else this.autosave.cancel();
  }

  /** Runs `write` after every earlier host write has finished. */
  private queued<T>(write: () => Promise<T>): Promise<T> {
    const run = this.writes.then(write, write);
    this.writes = run.catch(() => undefined);
    return run;
  }

  /** Writes the recovery copy now, if there are unsaved changes. */
  async autosaveNow(): Promise<void> {
    this.autosave.cancel();
    if (!this.dirty) return;
    try {
      await this.queued(async () => {
        const project = await this.workbench.project();
        const handle = this.handle ?? this.untitledHandle ?? undefined;
        const written = await host.autosaveProject(handle === undefined ? { project } : { handle, project });
        if (this.handle === null) this.untitledHandle = written.handle;
      });
      this.status = `Autosaved at ${new Date().toLocaleTimeString()}`;
    } catch (error) {
      this.problem = `Autosave failed: ${messageOf(error)}`;
    }
  }

  /** Saves to the project's file; a project never saved asks where first (Save as). */
  async save(): Promise<void> {
    if (this.handle === null) return this.saveAs();
    const handle = this.handle;
    await this.write(async (project) => host.saveProject({ handle, project }));
  }

  /** Saves to a file the user chooses: the host's dialog, or the in-page chooser in browser mode. */
  async saveAs(): Promise<void> {
    if (this.hostKind() === 'browser') {
      const listing = await this.listing();
      if (listing) this.chooser = { purpose: 'save', listing, suggestedName: this.name ?? `${(this.workbench.base?.font.familyName ?? 'Untitled').trim() || 'Untitled'}.stemline` };
      return;
    }
    await this.saveAsNamed(undefined);
  }

  /** Save as, to `name` in the workspace (browser mode) or where the dialog answers (undefined). */
  async saveAsNamed(name: string | undefined): Promise<void> {
    this.chooser = null;
    const replacing = this.handle ?? this.untitledHandle ?? undefined;
    await this.write(async (project) => host.saveProjectAs({ project, ...(name === undefined ? {} : { name }), ...(replacing === undefined ? {} : { replacing }) }));
  }

  private async write(save: (project: Awaited<ReturnType<Workbench['project']>>) => Promise<{ handle: ProjectHandle; name: string } | null>): Promise<void> {
    this.autosave.cancel();
    this.problem = null;
    this.busy = 'saving';
    try {
      const stamp = this.workbench.stamp;
      const saved = await this.queued(async () => save(await this.workbench.project()));
      if (saved === null) return; // the user cancelled the dialog
      this.handle = saved.handle;
      this.name = saved.name;
      this.untitledHandle = null;
      this.savedStamp = stamp;
      this.status = `Saved ${saved.name}`;
    } catch (error) {
      this.problem = `${messageOf(error)}`;
    } finally {
      this.busy = null;
      this.changed();
    }
  }

  private async listing(): Promise<ChooserRequest['listing'] | null> {
    try {
      const listing = await host.listProjects({});
      return listing.kind === 'workspace' ? listing : null;
    } catch (error) {
      this.problem = messageOf(error);
      return null;
    }
  }

  /** Opens a project the user chooses: the host's dialog, or the in-page chooser in browser mode. */
  async open(): Promise<void> {
    if (this.hostKind() === 'browser') {
      const listing = await this.listing();
      if (listing) this.chooser = { purpose: 'open', listing, suggestedName: '' };
      return;
    }
    await this.openNamed(undefined);
  }

  /**
   * Opens `name` (browser mode) or what the dialog answers. Unsaved changes are
   * autosaved first, so they can be recovered by opening their project again. When
   * the host holds autosaved work newer than the file, the user is asked which to keep.
   */
  async openNamed(name: string | undefined): Promise<void> {
    await this.openWith(() => host.openProject(name === undefined ? {} : { name }));
  }

  /** Opens the project file `handle` names (File ▸ Open recent, or a file the system handed the desktop app), as openNamed does. */
  async openRecent(handle: ProjectHandle): Promise<void> {
    await this.openWith(() => host.openRecentProject({ handle }));
  }

  private async openWith(open: () => Promise<OpenedProject | null>): Promise<void> {
    this.chooser = null;
    this.problem = null;
    await this.autosaveNow();
    this.busy = 'opening';
    try {
      const opened = await open();
      if (opened === null) return;
      const work = await host.findRecoveredWork({ handle: opened.handle });
      if (work) {
        this.recovery = { work, opened };
        return;
      }
      await this.restore(opened.project, opened.name);
      this.adopt(opened.handle, opened.name, true);
    } catch (error) {
      this.problem = messageOf(error);
    } finally {
      this.busy = null;
    }
  }

  /** Offers the latest autosaved work of a project never saved, if the host holds any (at start). */
  async offerUnsavedWork(): Promise<void> {
    try {
      const work = await host.findRecoveredWork({});
      if (work && this.recovery === null && !this.dirty && this.handle === null) this.recovery = { work, opened: null };
    } catch (error) {
      this.problem = messageOf(error);
    }
  }

  /** The user chose to restore the recovered work: it is restored and left unsaved (it is not in the file yet). */
  async restoreRecovered(): Promise<void> {
    const offer = this.recovery;
    if (!offer) return;
    this.busy = 'opening';
    this.problem = null;
    try {
      await this.restore(offer.work.project, offer.work.name ?? 'The recovered work');
      this.recovery = null;
      if (offer.opened) this.adopt(offer.opened.handle, offer.opened.name, false);
      else {
        this.handle = null;
        this.name = null;
        this.untitledHandle = offer.work.handle;
        this.savedStamp = [];
      }
      this.status = `Restored the work autosaved at ${new Date(offer.work.savedAt).toLocaleString()}; save to keep it in the file`;
    } catch (error) {
      this.problem = messageOf(error);
    } finally {
      this.busy = null;
      this.changed();
    }
  }

  /**
   * The user chose the saved version (or, for work never saved, to discard it): the
   * saved project is opened first, and only then is the recovered copy deleted.
   */
  async discardRecovered(): Promise<void> {
    const offer = this.recovery;
    if (!offer) return;
    this.busy = 'opening';
    this.problem = null;
    try {
      if (offer.opened) {
        await this.restore(offer.opened.project, offer.opened.name);
        this.adopt(offer.opened.handle, offer.opened.name, true);
      }
      this.recovery = null;
      await host.discardRecoveredWork({ handle: offer.work.handle });
    } catch (error) {
      this.problem = messageOf(error);
    } finally {
      this.busy = null;
    }
  }

  private async restore(project: RecoveredWork['project'], name: string): Promise<void> {
    await this.workbench.restore(project, name);
    this.demo = null;
    this.onRestored();
  }

  /**
   * Opens the host's demo project when the window starts empty: nothing is offered
   * for recovery and the user has not begun anything. The demo opens unsaved but
   * clean — nothing is autosaved until the user changes it. Problems are shown.
   */
  async openDemo(): Promise<void> {
    if (this.recovery !== null || this.handle !== null || this.dirty) return;
    await this.loadDemo();
  }

  /**
   * Opens the demo project again when the user asks for it from a new project: the
   * window's work is autosaved first, as for a new project, so nothing is lost.
   */
  async returnToDemo(): Promise<void> {
    await this.startNew();
    await this.loadDemo();
  }

  private async loadDemo(): Promise<void> {
    try {
      const demo = await host.openDemo({});
      if (demo === null || this.recovery !== null || this.handle !== null) return;
      this.demo = { title: demo.title, description: demo.description };
      if (!(await this.workbench.openDemo(demo))) {
        // Overtaken by what the user began meanwhile: that is what the window shows.
        if (this.name === null) this.demo = null;
        return;
      }
      this.savedStamp = this.workbench.stamp;
      this.status = `Opened the demo: ${demo.sheets[0]?.characters.replace(/\s/g, '').length ?? 0} letters fitted`;
      this.onRestored();
    } catch (error) {
      this.demo = null;
      this.problem = messageOf(error);
    }
  }

  /**
   * Starts a new, empty project in the window. Unsaved changes are autosaved first, so
   * they can be recovered; a demo still loading is dropped.
   */
  async startNew(): Promise<void> {
    this.problem = null;
    await this.autosaveNow();
    this.workbench.startNew();
    this.demo = null;
    this.handle = null;
    this.name = null;
    this.untitledHandle = null;
    this.savedStamp = this.workbench.stamp;
    this.status = 'Started a new project';
    this.onRestored();
  }

  /** The window now shows the project file `handle`; `saved`: its state is the file's. */
  private adopt(handle: ProjectHandle, name: string, saved: boolean): void {
    this.handle = handle;
    this.name = name;
    this.untitledHandle = null;
    this.savedStamp = saved ? this.workbench.stamp : [];
    this.status = saved ? `Opened ${name}` : this.status;
  }
}
