/**
 * The parts of the page its first paint does not need, each its own chunk: the design form (with its proposal view),
 * the instrument-profile maker, the share and export actions, the printable report, the measured controls and the
 * pilot-image unmixing. The page starts fetching them as soon as it is attached, beside the checks; until a part
 * arrives its tag stays an empty element, and Lit hands it the properties the page already set once it is defined.
 */
export function loadLaterParts(): Promise<unknown> {
  return Promise.all([
    import('./design-form'),
    import('./instrument-maker'),
    import('./panel-actions'),
    import('./panel-report'),
    import('./controls-section'),
    import('./pilot-image'),
  ]);
}
