import { describe, expect, it } from 'vitest';
import { nameCharacterProblem, nameSchema } from './names';

describe('one name schema', () => {
  it('when a name holds NUL, another control character or a bidirectional control, then it is refused naming the character', () => {
    const cases: [string, RegExp][] = [
      ['Eth\u0000anol', /a control character, U\+0000, at character 4/],
      ['Ethanol\u001b[31m', /U\+001B/],
      ['Ethanol\u0085', /U\+0085/],
      ['\u202Elonahte', /a text-direction control, U\+202E, at character 1/],
      ...['\u202A', '\u202B', '\u202C', '\u202D', '\u2066', '\u2067', '\u2068', '\u2069'].map(
        (c): [string, RegExp] => [`a${c}b`, /text-direction control/],
      ),
    ];
    for (const [name, message] of cases) {
      const result = nameSchema(200).safeParse(name);
      expect(result.success, name).toBe(false);
      expect(result.error?.issues[0]?.message).toMatch(message);
    }
  });

  it('when a name is ordinary text in any script, then it passes trimmed', () => {
    for (const name of ['Ethanol', 'Natriumchlorid (Ä)', 'حمض الخليك', '2-Propanol ≥ 99.5 %']) {
      expect(nameSchema(200).parse(` ${name} `)).toBe(name);
      expect(nameCharacterProblem(name)).toBeNull();
    }
  });

  it('when a name is empty or too long, then the usual messages apply', () => {
    expect(nameSchema(5).safeParse('  ').error?.issues[0]?.message).toBe('is required');
    expect(nameSchema(5, 'name it').safeParse('').error?.issues[0]?.message).toBe('name it');
    expect(nameSchema(5).safeParse('abcdef').error?.issues[0]?.message).toBe(
      'is at most 5 characters',
    );
  });
});
