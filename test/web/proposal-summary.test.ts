// Component tests in headless Chromium for the proposal summary's "no usable panel" answer.
import { afterEach, describe, expect, it } from 'vitest';
import type { DesignResult } from '../../spectra/index';
import '../../web/elements/proposal-summary';

afterEach(() => document.body.replaceChildren());

const noPanel: DesignResult = {
  mode: 'free',
  panel: null,
  evaluation: null,
  objective: null,
  exact: false,
  stats: null,
  noise: null,
  verdict: 'no_usable_panel',
  verdictReason: 'within its node budget the search found no design of 16 targets on the grid',
  largestUsableTargets: 6,
  warnings: [],
};

describe('<qdp-proposal-summary> with no usable panel', () => {
  it('says why, that 6 targets would work keeping the more abundant, and offers Discard but no Load', async () => {
    const el = document.createElement('qdp-proposal-summary');
    el.result = noPanel;
    document.body.appendChild(el);
    await el.updateComplete;
    const text = el.shadowRoot!.textContent ?? '';
    expect(text).toContain('No usable panel');
    expect(text).toContain('found no design of 16 targets');
    expect(text).toContain('A usable panel was found for 6 targets, keeping the more abundant ones');
    const buttons = [...el.shadowRoot!.querySelectorAll('button')].map((b) => b.textContent?.trim());
    expect(buttons).toEqual(['Discard']);
  });
});
