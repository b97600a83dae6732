// The one-letter editor's view settings, which its sliders and the View menu share. If
// these broke, hiding the combs or the scan from the menu and showing them again would
// lose the length or opacity the designer had set, or a zoom command would reach a
// letter no longer on screen.
import { describe, expect, it } from 'vitest';
import { DEFAULT_COMB_LENGTH, DEFAULT_SCAN_OPACITY, ViewSettings } from '../../renderer/src/editor/view-settings.svelte.ts';
import { KEY_ZOOM_FACTOR } from '../../renderer/src/editor/view-transform.ts';

describe('view settings', () => {
  it('starts with the combs at 1× and the scan faint', () => {
    const view = new ViewSettings();
    expect(view.combLength).toBe(DEFAULT_COMB_LENGTH);
    expect(view.scanOpacity).toBe(DEFAULT_SCAN_OPACITY);
    expect(view.combsShown && view.scanShown).toBe(true);
  });

  it('hides the combs and brings them back at the length the designer had set', () => {
    const view = new ViewSettings();
    view.combLength = 2.5;
    view.toggleCombs();
    expect(view.combLength).toBe(0);
    expect(view.combsShown).toBe(false);
    view.toggleCombs();
    expect(view.combLength).toBe(2.5);
    // A length set while shown again is the one remembered next time.
    view.combLength = 0.7;
    view.toggleCombs();
    view.toggleCombs();
    expect(view.combLength).toBe(0.7);
  });

  it('shows combs dragged to nothing on the slider at the length they had when last hidden, not a sliver', () => {
    const view = new ViewSettings();
    view.combLength = 3;
    view.toggleCombs();
    view.toggleCombs();
    // The slider passes 0.1 on its way down; showing the combs at that would barely show them.
    view.combLength = 0.1;
    view.combLength = 0;
    view.toggleCombs();
    expect(view.combLength).toBe(3);
  });

  it('shows combs never shown at 1×', () => {
    const view = new ViewSettings();
    view.combLength = 0;
    view.toggleCombs();
    expect(view.combLength).toBe(DEFAULT_COMB_LENGTH);
  });

  it('hides the scan and brings it back at its opacity, independently of the combs', () => {
    const view = new ViewSettings();
    view.scanOpacity = 0.8;
    view.combLength = 1.5;
    view.toggleScan();
    expect(view.scanOpacity).toBe(0);
    expect(view.combLength).toBe(1.5);
    view.toggleCombs();
    view.toggleScan();
    expect(view.scanOpacity).toBe(0.8);
    expect(view.combLength).toBe(0);
  });

  it('sends the zoom commands to the letter on screen, and to nothing once it is gone', () => {
    const view = new ViewSettings();
    const factors: number[] = [];
    view.zoomIn(); // no letter yet: nothing happens, nothing throws
    const detach = view.attachZoom({ zoomBy: (factor) => factors.push(factor) });
    view.zoomIn();
    view.zoomOut();
    expect(factors).toEqual([KEY_ZOOM_FACTOR, 1 / KEY_ZOOM_FACTOR]);
    // A new letter's canvas takes over before the old one lets go: the old one's letting go must not drop the new one.
    const next: number[] = [];
    const detachNext = view.attachZoom({ zoomBy: (factor) => next.push(factor) });
    detach();
    view.zoomIn();
    expect(next).toEqual([KEY_ZOOM_FACTOR]);
    detachNext();
    view.zoomIn();
    expect(factors).toHaveLength(2);
    expect(next).toHaveLength(1);
  });
});
