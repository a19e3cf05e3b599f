import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { env } from '@/config/env';
import { api } from '@/lib/api-client';
import type { Member } from './get-members';
import { membersQueryOptions } from './get-members';

const PHONE = /^(\+?[0-9 ()./-]{5,40})?$/;
const PHONE_MESSAGE = 'Write a phone number with digits, spaces and + ( ) - only, like +1 555 0142.';

const today = () => {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
};

const detailsFields = {
  name: yup.string().trim().required('Enter her name.').max(120, 'Use at most 120 characters.'),
  email: yup.string().trim().email('Enter an e-mail address like name@example.com, or leave it empty.').max(254, 'That e-mail address is too long.'),
  phone: yup.string().trim().matches(PHONE, PHONE_MESSAGE),
  town: yup.string().trim().max(120, 'Use at most 120 characters.'),
};

export const paperMemberSchema = yup.object({
  ...detailsFields,
  memberSince: yup
    .string()
    .test('real', 'Choose a real date.', (v) => !v || !Number.isNaN(new Date(`${v}T12:00:00`).getTime()))
    .test('past', 'The date she joined cannot be after today.', (v) => !v || v <= today()),
});

export const memberDetailsSchema = yup.object(detailsFields);

export type PaperMemberValues = { name: string; email: string; phone: string; town: string; memberSince: string; showPhone: boolean; showTown: boolean };
export type MemberDetailsValues = { name: string; email: string; phone: string; town: string; showEmail: boolean; showPhone: boolean; showTown: boolean };

/** Empty boxes are sent as null ("none"). */
const orNull = (v: string) => v.trim() || null;

export const addPaperMember = (guildId: string, v: PaperMemberValues) =>
  api.post<Member>(`/guilds/${encodeURIComponent(guildId)}/members`, {
    name: v.name.trim(),
    email: orNull(v.email),
    phone: orNull(v.phone),
    town: orNull(v.town),
    memberSince: orNull(v.memberSince),
    showPhone: v.showPhone,
    showTown: v.showTown,
  });

export const updateMemberDetails = (guildId: string, membershipId: number | string, v: MemberDetailsValues) =>
  api.patch<Member>(`/guilds/${encodeURIComponent(guildId)}/members/${encodeURIComponent(String(membershipId))}/details`, {
    name: v.name.trim(),
    email: orNull(v.email),
    phone: orNull(v.phone),
    town: orNull(v.town),
    showEmail: v.showEmail,
    showPhone: v.showPhone,
    showTown: v.showTown,
  });

export function useAddPaperMember(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (v: PaperMemberValues) => addPaperMember(guildId, v),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersQueryOptions(guildId).queryKey }),
  });
}

export function useUpdateMemberDetails(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ membershipId, values }: { membershipId: number | string; values: MemberDetailsValues }) => updateMemberDetails(guildId, membershipId, values),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersQueryOptions(guildId).queryKey }),
  });
}

/** The printed roster: each reader gets what she may see on the members page. */
export const rosterPdfHref = (guildId: string) => `${env.apiBaseUrl}/guilds/${encodeURIComponent(guildId)}/roster.pdf`;

/** "Kept on paper" (no e-mail address) or "Has not signed in yet"; null for a member who signs in or when unknown. */
export function paperBadge(member: Pick<Member, 'signsIn' | 'email'>): string | null {
  if (member.signsIn !== false) return null;
  return member.email ? 'Has not signed in yet' : 'Kept on paper';
}
