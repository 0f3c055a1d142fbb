// Safety note: the caution (with the risky systems named) until the person marks it read; then gone for them on that
// build, still there on another build and for another person.
import { inputBinding, signal } from '@angular/core';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import { SAFETY_CAUTION } from '../../../../shared/safety';
import { Session } from '../../core/auth/session';
import { SafetyNote } from './safety-note';

async function renderNote(buildId: string, userId: string) {
  await render(SafetyNote, {
    providers: [{ provide: Session, useValue: { user: signal({ id: userId, email: `${userId}@example.test`, displayName: userId }) } }],
    bindings: [inputBinding('buildId', () => buildId), inputBinding('systems', () => ['Fuel', 'Wiring harness'])],
  });
}

const note = () => screen.queryByRole('complementary', { name: 'Safety caution' });

beforeEach(() => localStorage.clear());

describe('SafetyNote', () => {
  it('names the risky systems before the caution, and hides once read, remembering it for that person and build', async () => {
    await renderNote('b-1', 'u-1');
    expect(note()!.textContent?.replace(/\s+/g, ' ')).toContain(`Fuel, Wiring harness: ${SAFETY_CAUTION}`);
    await userEvent.setup().click(screen.getByRole('button', { name: 'Understood, hide this' }));
    expect(note()).toBeNull();
    expect(localStorage.getItem('tallyhood.safety-note-read.u-1.b-1')).not.toBeNull();
  });

  it('stays hidden for the person who read it on that build', async () => {
    localStorage.setItem('tallyhood.safety-note-read.u-1.b-1', '2026-12-01T10:00:00.000Z');
    await renderNote('b-1', 'u-1');
    expect(note()).toBeNull();
  });

  it('still shows on another build', async () => {
    localStorage.setItem('tallyhood.safety-note-read.u-1.b-1', '2026-12-01T10:00:00.000Z');
    await renderNote('b-2', 'u-1');
    expect(note()).not.toBeNull();
  });

  it('still shows to another person on the same build', async () => {
    localStorage.setItem('tallyhood.safety-note-read.u-1.b-1', '2026-12-01T10:00:00.000Z');
    await renderNote('b-1', 'u-2');
    expect(note()).not.toBeNull();
  });
});
