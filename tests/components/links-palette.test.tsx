import { act, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { BondCaution } from '@/components/editor/panels/BondCaution';
import { Palette } from '@/components/editor/panels/Palette';
import { EditorStoreContext } from '@/components/editor/selectors';
import { createEditorStore } from '@/components/editor/store';
import { findStarter } from '@/lib/domain/starters';

const setup = () => {
  const store = createEditorStore({ doc: { ...findStarter('tangent-bucket')!.build('Palette'), links: [] } });
  render(
    <EditorStoreContext.Provider value={store}>
      <Palette onPlace={() => undefined} />
      <BondCaution />
    </EditorStoreContext.Provider>,
  );
  return store;
};

describe('the link tools', () => {
  it('say in one line each what a jumper, a bond and a reach are', () => {
    setup();
    expect(screen.getByTestId('tool-hint-jumper').textContent).toMatch(/temporary grounding lead.*rated/i);
    expect(screen.getByTestId('tool-hint-bond').textContent).toMatch(/permanent connection.*never.*phase/i);
    expect(screen.getByTestId('tool-hint-reach').textContent).toMatch(/worker can touch.*no current/i);
  });

  it('ask before a bond on a phase and draw a jumper when asked to', async () => {
    const store = setup();
    await userEvent.click(screen.getByRole('button', { name: /^Bond/ }));
    act(() => {
      store.getState().tapElement('B');
      store.getState().tapElement('CB');
    });
    expect(screen.getByRole('alertdialog')).toHaveTextContent(/A jumper belongs here/);
    expect(store.getState().doc.links).toHaveLength(0);
    await userEvent.click(screen.getByRole('button', { name: 'Draw a jumper instead' }));
    expect(store.getState().doc.links).toEqual([expect.objectContaining({ kind: 'jumper', from: 'B', to: 'CB' })]);
    expect(screen.queryByRole('alertdialog')).toBeNull();
  });
});
