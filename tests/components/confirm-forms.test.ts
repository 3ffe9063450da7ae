/** Return and Disable ask first; Approve and Enable do not. */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { confirmQuestion, installConfirm } from '@/scripts/confirm-forms';

afterEach(() => { document.body.innerHTML = ''; });

function submit(form: HTMLFormElement, submitter?: HTMLElement): boolean {
  const event = new Event('submit', { bubbles: true, cancelable: true }) as SubmitEvent;
  Object.defineProperty(event, 'submitter', { value: submitter ?? null });
  form.dispatchEvent(event);
  return !event.defaultPrevented;
}

describe('confirm before a submission', () => {
  it('the decision form asks only for Return, and a No keeps the form from going', () => {
    document.body.innerHTML = `<form data-confirm="Return this plan?" data-confirm-field="decision" data-confirm-value="return">
      <input type="radio" name="decision" value="approve" /><input type="radio" name="decision" value="return" /><button>Record</button></form>`;
    const form = document.querySelector('form')!;
    const ask = vi.fn(() => false);
    installConfirm(document, ask);
    (form.querySelector('[value=approve]') as HTMLInputElement).checked = true;
    expect(submit(form)).toBe(true);
    expect(ask).not.toHaveBeenCalled();
    (form.querySelector('[value=return]') as HTMLInputElement).checked = true;
    expect(submit(form)).toBe(false);
    expect(ask).toHaveBeenCalledWith('Return this plan?');
    ask.mockReturnValue(true);
    expect(submit(form)).toBe(true);
  });

  it('a button with its own question (Disable) asks; the form without one does not', () => {
    document.body.innerHTML = '<form><button name="action" value="disable" data-confirm="Disable Pat?">Disable</button><button name="action" value="enable">Enable</button></form>';
    const form = document.querySelector('form')!;
    const [disable, enable] = [...form.querySelectorAll('button')];
    expect(confirmQuestion(form, disable)).toBe('Disable Pat?');
    expect(confirmQuestion(form, enable)).toBeNull();
  });
});
