import { act, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { SignedOutDialog } from '@/components/editor/panels/SignedOutDialog';
import { SaveIndicator } from '@/components/editor/panels/SaveIndicator';
import { EditorStoreContext } from '@/components/editor/selectors';
import { createEditorStore } from '@/components/editor/store';
import { findStarter } from '@/lib/domain/starters';

describe('an ended session in the editor', () => {
  it('says so, links to sign-in in a new tab back to this plan, and saves on request', async () => {
    const store = createEditorStore({ doc: findStarter('tangent-bucket')!.build() });
    const onResume = vi.fn();
    render(
      <EditorStoreContext.Provider value={store}>
        <SignedOutDialog planId={42} onResume={onResume} />
      </EditorStoreContext.Provider>,
    );
    expect(screen.queryByRole('alertdialog')).toBeNull();
    act(() => store.getState().setSaveState('signed-out'));
    expect(screen.getByRole('alertdialog')).toHaveTextContent(/session has ended.*kept on this device/);
    const link = screen.getByRole('link', { name: 'Sign in in a new tab' });
    expect(link.getAttribute('href')).toBe('/login?next=%2Fplans%2F42');
    expect(link.getAttribute('target')).toBe('_blank');
    await userEvent.click(screen.getByRole('button', { name: /save now/ }));
    expect(onResume).toHaveBeenCalledTimes(1);
  });

  it('the save indicator never calls a refusal "offline"', () => {
    const { rerender } = render(<SaveIndicator state="signed-out" />);
    expect(screen.getByTestId('save-state')).toHaveTextContent('Signed out');
    rerender(<SaveIndicator state="too-large" />);
    expect(screen.getByTestId('save-state')).toHaveTextContent('Too large to save');
    rerender(<SaveIndicator state="forbidden" />);
    expect(screen.getByTestId('save-state')).not.toHaveTextContent(/offline/i);
  });
});
