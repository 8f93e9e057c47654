/**
 * The typefaces embedded in the exhibit. Change FONT_DIR and the file names here to switch the
 * exhibit's typeface; nothing else refers to font files.
 */
import fs from 'node:fs';
import path from 'node:path';

export const FONT_DIR = path.resolve(__dirname, '../../assets/fonts');

/**
 * The exhibit's typeface: IBM Plex (SIL OFL, licence beside the files). The app's own WOFF2 faces
 * cannot be subset by fontkit (its TrueType subsetter fails on WOFF2's transformed glyph table),
 * so the exhibit switches to them when TTF files of the same faces are shipped: change the five
 * names below.
 */
export const FONT_FILES = {
  regular: 'exhibit/IBMPlexSans_400Regular.ttf',
  medium: 'exhibit/IBMPlexSans_500Medium.ttf',
  semibold: 'exhibit/IBMPlexSans_600SemiBold.ttf',
  bold: 'exhibit/IBMPlexSans_700Bold.ttf',
  mono: 'exhibit/IBMPlexMono_400Regular.ttf',
} as const;

/** Characters a face lacks (Greek letters in the mono face, say) are set in this one. */
export const SYMBOL_FONT_FILE = 'exhibit/IBMPlexSans_400Regular.ttf';

/** The family name the DOCX asks Word to use (Word substitutes when it is not installed). */
export const DOCX_FONT_FAMILY = 'IBM Plex Sans';
export const DOCX_MONO_FAMILY = 'IBM Plex Mono';

export type FontRole = keyof typeof FONT_FILES | 'symbols';

let cache: Record<FontRole, Uint8Array> | undefined;

/** The font files' bytes, read once per process. */
export function fontBytes(): Record<FontRole, Uint8Array> {
  cache ??= Object.fromEntries(Object.entries({ ...FONT_FILES, symbols: SYMBOL_FONT_FILE }).map(([role, file]) => [role, fs.readFileSync(path.join(FONT_DIR, file))])) as unknown as Record<
    FontRole,
    Uint8Array
  >;
  return cache;
}
