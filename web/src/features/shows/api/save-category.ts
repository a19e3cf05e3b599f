import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CategoryInput } from '../lib/category-form';
import { showPath, showQueryKey } from './show-path';
import type { Category } from './types';

const categoriesPath = (guildId: string, showId: string) => `${showPath(guildId, showId)}/categories`;

export const createCategory = (guildId: string, showId: string, input: CategoryInput) => api.post<Category>(categoriesPath(guildId, showId), input);

export const updateCategory = (guildId: string, showId: string, categoryId: number, input: Partial<CategoryInput>) =>
  api.patch<Category>(`${categoriesPath(guildId, showId)}/${encodeURIComponent(String(categoryId))}`, input);

export const deleteCategory = (guildId: string, showId: string, categoryId: number) =>
  api.delete(`${categoriesPath(guildId, showId)}/${encodeURIComponent(String(categoryId))}`);

/** Add (categoryId null) or change one category; the show is fetched again after. */
export function useSaveCategory(guildId: string, showId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ categoryId, input }: { categoryId: number | null; input: CategoryInput }) =>
      categoryId === null ? createCategory(guildId, showId, input) : updateCategory(guildId, showId, categoryId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: showQueryKey(guildId, showId) }),
  });
}

/** Several new categories, one POST each, in order; stops at the first refusal. */
export function useAddCategories(guildId: string, showId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (inputs: readonly CategoryInput[]) => {
      const added: Category[] = [];
      for (const input of inputs) added.push(await createCategory(guildId, showId, input));
      return added;
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: showQueryKey(guildId, showId) }),
  });
}

export function useDeleteCategory(guildId: string, showId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (categoryId: number) => deleteCategory(guildId, showId, categoryId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: showQueryKey(guildId, showId) }),
  });
}
