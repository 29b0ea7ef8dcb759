/** The words of the light settings, said once: the light editor's field labels and the printed report's settings. */
export const LIGHT_WORDS = {
  relativePower: 'Relative power',
  backgroundLevel: 'Background level',
  sampleType: 'Sample type',
  genericBackground: 'generic tissue (default model)',
  waterRaman: 'Water Raman',
  waterRamanLevel: 'Water Raman level',
  scatter: 'Scattered excitation light',
  minBlocking: 'Warn when a channel blocks a line by less than',
} as const;
