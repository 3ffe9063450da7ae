/**
 * Asks before a form does something hard to undo. A submit button with `data-confirm` asks its
 * question; a form with `data-confirm` asks it only when its field `data-confirm-field` has the
 * value `data-confirm-value` (Return on the decision form, not Approve). A bundled module, not an
 * inline script: the CSP allows no inline code of ours.
 */

/** The question to ask before this submission, or null when none is needed. */
export function confirmQuestion(form: HTMLFormElement, submitter: HTMLElement | null): string | null {
  const own = submitter?.dataset.confirm;
  if (own) return own;
  const question = form.dataset.confirm;
  if (!question) return null;
  const field = form.dataset.confirmField;
  if (!field) return question;
  const value = new FormData(form).get(field);
  return value === form.dataset.confirmValue ? question : null;
}

/** Listens on `root` for submissions and cancels one the user does not confirm. */
export function installConfirm(root: Document, ask: (question: string) => boolean = (q) => window.confirm(q)): void {
  root.addEventListener('submit', (event) => {
    const form = event.target;
    if (!(form instanceof HTMLFormElement)) return;
    const question = confirmQuestion(form, (event as SubmitEvent).submitter ?? null);
    if (question && !ask(question)) event.preventDefault();
  });
}
