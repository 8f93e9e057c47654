/**
 * Every "from memory" / "secondary source" remark in the engine's and reference tables' strings
 * reaches the screen in a lab's words (components/source-words.ts): a new remark is covered too.
 */
import { execSync } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { sourceWords } from '../../components/source-words';

const ROOT = path.resolve(__dirname, '../..');
const TEAM_WORDS = /from memory|verify before release|secondary sources?\b|as recalled/i;

/** Every quoted string in calc/ and constants/ that carries such a remark (comments left out). */
function remarksInTheEngine(): string[] {
  const out = execSync('grep -rhn -i "from memory\\|secondary source\\|verify before" calc constants --include=*.ts', { cwd: ROOT }).toString();
  return out
    .split('\n')
    .filter((l) => !/^\d+:\s*(\/\/|\*|\/\*)/.test(l))
    .map((l) => l.match(/['`]([^'`]*(from memory|secondary source|verify before)[^'`]*)['`]/i)?.[1])
    .filter((s): s is string => !!s);
}

describe('source words over the engine', () => {
  it('leaves no remark for the engine’s authors in any of its strings, and no broken brackets', () => {
    const remarks = remarksInTheEngine();
    expect(remarks.length).toBeGreaterThan(30);
    const left = remarks.map(sourceWords).filter((s) => TEAM_WORDS.test(s) || /\(\s*[;,)]|;\s*;|\(\(/.test(s));
    expect(left).toEqual([]);
  });
});
