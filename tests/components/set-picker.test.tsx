/** The inspector's set picker: search the in-service sets, take one, its figures fill the jumper. */
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createElement } from 'react';
import { afterEach, expect, it, vi } from 'vitest';
import { Inspector } from '@/components/editor/panels/Inspector';
import { EditorStoreContext } from '@/components/editor/selectors';
import { createEditorStore } from '@/components/editor/store';
import { findStarter } from '@/lib/domain/starters';

const SET = { id: 7, tag: 'GS-42', description: 'Invented', cable: '4/0', lengthM: 4.5, clampKind: 'live-line', clampKa: 43, clampCycles: 30, connection: 'bare-strands', status: 'in-service', lastTestedOn: '2026-01-02', testDueOn: '2999-01-02' };
afterEach(() => vi.unstubAllGlobals());

function setup() {
  const fetchMock = vi.fn(async (url: string) => new Response(JSON.stringify({ items: url.includes('q=NONE') ? [] : [SET], total: 1, page: 1, pageSize: 20 }), { status: 200 }));
  vi.stubGlobal('fetch', fetchMock);
  const store = createEditorStore({ doc: findStarter('tangent-bucket')!.build() });
  store.getState().select(['jA']);
  render(createElement(EditorStoreContext.Provider, { value: store }, createElement(Inspector)));
  return { store, fetchMock };
}

const jumper = (store: ReturnType<typeof setup>['store']) => store.getState().doc.links.find((l) => l.id === 'jA') as Record<string, unknown>;

it('asks for nothing until opened, then lists only in-service sets matching the search', async () => {
  const { fetchMock } = setup();
  const picker = await screen.findByTestId('set-picker');
  expect(fetchMock).not.toHaveBeenCalled();
  await userEvent.click(within(picker).getByRole('button', { name: 'Take a set from the inventory' }));
  await userEvent.type(within(picker).getByLabelText('Search in-service sets by tag'), 'NONE');
  await within(picker).findByText('No in-service set matches.');
  const last = String(fetchMock.mock.calls.at(-1)?.[0]);
  expect(last).toContain('status=in-service');
  expect(last).toContain('q=NONE');
});

it("fills the jumper from the set and shows the figures as the set's", async () => {
  const { store } = setup();
  const picker = await screen.findByTestId('set-picker');
  await userEvent.click(within(picker).getByRole('button', { name: 'Take a set from the inventory' }));
  await userEvent.click(await within(picker).findByRole('button', { name: /GS-42/ }));
  expect(jumper(store)).toMatchObject({ equipmentId: 'GS-42', cable: '4/0', lengthM: 4.5, clampKa: 43, clampCycles: 30, clampKind: 'live-line', connection: 'bare-strands' });
  const taken = await within(picker).findByTestId('set-taken');
  expect(taken.textContent).toContain("From the set's record");
  // The editor reads feet by default: 4.5 m is 14.76 ft, 14 ft 9 in.
  expect(taken.textContent).toContain('cable 4/0, 14 ft 9 in');
  await userEvent.click(within(picker).getByRole('button', { name: 'No set' }));
  await waitFor(() => expect(jumper(store).equipmentId).toBeUndefined());
  // Undo brings the set back: taking a set is one ordinary edit.
  store.getState().undo();
  expect(jumper(store).equipmentId).toBe('GS-42');
});
