import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { rosterBody, type ColumnUse, type DateOrder, type RosterOptions, type RosterSource } from './roster-body';

export type RowAction = 'new' | 'update' | 'unchanged' | 'skip';

export type PreviewRow = {
  rowNumber: number;
  values: {
    name: string;
    email: string | null;
    phone: string | null;
    town: string | null;
    household: string | null;
    memberSince: string | null;
    paidThrough: string | null;
    roles: string[];
  };
  problems: string[];
  action: RowAction;
  existingAccount: boolean;
  changes: { field: string; from: string | null; to: string | null }[];
};

export type RosterPreview = {
  delimiter: 'comma' | 'semicolon' | 'tab';
  header: string[];
  mapping: ColumnUse[];
  guessed: boolean;
  mappingProblem: string | null;
  dateOrder: DateOrder;
  counts: { rows: number; new: number; update: number; unchanged: number; problems: number };
  page: number;
  pageCount: number;
  pageSize: number;
  onlyProblems: boolean;
  rows: PreviewRow[];
};

export type PreviewInput = { source: RosterSource } & RosterOptions;

export const previewRoster = (guildId: string, { source, ...options }: PreviewInput) => {
  const path = `/guilds/${encodeURIComponent(guildId)}/roster-import/preview`;
  const body = rosterBody(source, options);
  return body instanceof FormData ? api.upload<RosterPreview>(path, body) : api.post<RosterPreview>(path, body);
};

export function usePreviewRoster(guildId: string) {
  return useMutation({ mutationFn: (input: PreviewInput) => previewRoster(guildId, input) });
}
