import { describe, expect, it } from 'vitest';
import {
  drawField,
  isTypingTarget,
  matchKeys,
  registerSlashTarget,
  shortcuts,
  shortcutsFor,
  slashTarget,
} from './shortcuts';

describe('shortcuts', () => {
  it('when keys are pressed, then a whole shortcut matches, its first key waits, others do not', () => {
    expect(matchKeys(shortcuts, ['g'])).toBe('partial');
    expect(matchKeys(shortcuts, ['g', 's'])).toEqual({
      shortcut: expect.objectContaining({ id: 'stock' }),
    });
    expect(matchKeys(shortcuts, ['?'])).toEqual({
      shortcut: expect.objectContaining({ id: 'help' }),
    });
    expect(matchKeys(shortcuts, ['g', 'x'])).toBeNull();
    expect(matchKeys(shortcuts, ['x'])).toBeNull();
  });

  it('when a role lacks a permission, then its shortcut is not offered', () => {
    expect(shortcutsFor('viewer').map((s) => s.id)).toEqual(['search', 'home', 'stock', 'help']);
    expect(shortcutsFor('member').map((s) => s.id)).toContain('draw');
  });

  it('when the key goes to a field or an open dialog, then it counts as typing', () => {
    document.body.innerHTML = `
      <input id="text" /><div id="plain" contenteditable="true"></div><p id="para"></p>
      <dialog open><button id="in-dialog">Close</button></dialog>`;
    expect(isTypingTarget(document.getElementById('text'))).toBe(true);
    expect(isTypingTarget(document.getElementById('plain'))).toBe(true);
    expect(isTypingTarget(document.getElementById('in-dialog'))).toBe(true);
    expect(isTypingTarget(document.getElementById('para'))).toBe(false);
    expect(isTypingTarget(document.body)).toBe(false);
  });

  it('when pages register search boxes, then / goes to the latest one still on the page', () => {
    document.body.innerHTML = '<input id="first" /><input id="second" />';
    const first = { current: document.getElementById('first') as HTMLInputElement };
    const second = { current: document.getElementById('second') as HTMLInputElement };
    const unregisterFirst = registerSlashTarget(first);
    const unregisterSecond = registerSlashTarget(second);
    expect(slashTarget()).toBe(second.current);
    unregisterSecond();
    expect(slashTarget()).toBe(first.current);
    unregisterFirst();
    expect(slashTarget()).toBeNull();
  });

  it('when a draw form is marked, then d finds its first field past the mode radios', () => {
    document.body.innerHTML = `
      <form data-shortcut-target="draw"><input type="radio" /><input id="amount" /></form>`;
    expect(drawField()).toBe(document.getElementById('amount'));
    document.body.innerHTML = '<form><input /></form>';
    expect(drawField()).toBeNull();
  });
});
