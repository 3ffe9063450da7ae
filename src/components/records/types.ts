/** The record as GET /api/records/:id answers it (the parts the field screen reads). */
import type { BriefingItem, Flag, NextStep, RecordPlan, SetOn, FieldEntry, InventorySet } from '@/lib/domain/field-record';
import type { PlanDocument } from '@/lib/schemas/plan';

/** An entry of the log; `waiting` while it is only on this device, `refused` when the server said no. */
export type EntryView = FieldEntry & { id: number; actorName: string; flags: Flag[]; recordedAt: string; waiting?: boolean; refused?: { code: string; message: string; items?: string[] } };

export interface RecordView {
  id: number;
  planId: number;
  planTitle: string;
  revision: number;
  status: 'open' | 'closed';
  workDate: string;
  structure: string;
  location: string;
  clearanceRef: string;
  detector: string;
  lead: { id: string; name: string };
  closedAt: string | null;
  closedBy: { id: string; name: string } | null;
  counts: { on: number; installed: number; removed: number };
  setsOn: SetOn[];
  voltageFound: boolean;
  testPassed: boolean;
  briefing: Partial<Record<BriefingItem, { by: string; at: string }>>;
  next: NextStep;
  plan: RecordPlan;
  document: PlanDocument;
  entries: EntryView[];
  photos: { id: number; caption: string; width: number; height: number; url: string }[];
  /** The organisation's sets, the server's judging day and the organisation's zone, sent with an open record (the device judges installs by them). */
  inventory?: { today: string; timeZone?: string; sets: (InventorySet & { description: string })[] };
}

export interface CrewPerson {
  id: string;
  name: string;
}
