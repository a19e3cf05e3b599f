import { useMutation } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { parseInches } from '@/lib/inches';

/** A length as the api sends it: a number of inches, a quilter's string, or a size-like object. */
export type Length = number | string | { text?: string; inches?: number; mm?: number } | null | undefined;

export type Arrangement = { rows: number; columns: number; used: number; leftover: number };

export type BedFit = {
  bed?: string;
  label?: string;
  name?: string;
  /** Whether the quilt covers the mattress top. */
  covers?: boolean;
  /** Inches over each side (negative: narrower than the mattress). */
  sideDrop?: Length;
  /** Inches over the foot. */
  footDrop?: Length;
};

export type SashingPieces = { strips: number; shortStrips?: number; longStrips?: number; cornerstones: number; description?: string };

export type LayoutPlan = {
  rows: number;
  columns: number;
  top: { width: Length; height: Length; widthText?: string; heightText?: string };
  beds: BedFit[];
  /** The sashing width (inches), or the pieces in the first drafts of the api. */
  sashing?: number | SashingPieces | null;
  sashingPieces?: SashingPieces | null;
  binding: { length: Length; strips: number; fabric: Length };
  backing: { width: Length; height: Length; pieces: number; yardage: Length; seams?: string; pieceLength?: Length };
  batting: { width: Length; height: Length };
};

export type LayoutPlanResult = { arrangements: Arrangement[]; plan: LayoutPlan; svg: string };

export type LayoutPlanInput = {
  blockCount: number;
  blockWidth: string;
  blockHeight: string;
  sashing?: string;
  sashingAround?: boolean;
  cornerstones?: boolean;
  borders?: string[];
  bindingWidth?: string;
  fabricWidth?: string;
  backingMargin?: string;
  battingMargin?: string;
  rows?: number;
  columns?: number;
};

export type LayoutPlanValues = {
  blockCount: string;
  blockWidth: string;
  blockHeight: string;
  sashing: string;
  sashingAround: boolean;
  cornerstones: boolean;
  borders: string[];
  bindingWidth: string;
  fabricWidth: string;
  backingMargin: string;
  battingMargin: string;
};

export const layoutPlanDefaults: LayoutPlanValues = {
  blockCount: '30',
  blockWidth: '12',
  blockHeight: '12',
  sashing: '',
  sashingAround: false,
  cornerstones: false,
  borders: [],
  bindingWidth: '2 1/2',
  fabricWidth: '40',
  backingMargin: '4',
  battingMargin: '4',
};

const inches = (message: string) =>
  yup
    .string()
    .trim()
    .test('inches', message, (v) => !v || (parseInches(v) ?? -1) >= 0);

export const layoutPlanSchema = yup.object({
  blockCount: yup
    .number()
    .transform((value, original) => (original === '' ? undefined : value))
    .typeError('Enter a number of blocks, like 30.')
    .required('Enter how many blocks you have.')
    .integer('Enter a whole number of blocks.')
    .min(1, 'You need at least 1 block.')
    .max(1000, 'That is more blocks than the planner handles.'),
  blockWidth: inches('Write inches, like 12 or 12 1/2.').required('Enter the finished block width.'),
  blockHeight: inches('Write inches, like 12 or 12 1/2.').required('Enter the finished block height.'),
  sashing: inches('Write inches, like 2 or 2 1/2.'),
  borders: yup.array(inches('Write inches, like 4.').required('Enter a width or remove this border.')),
  bindingWidth: inches('Write inches, like 2 1/2.'),
  fabricWidth: inches('Write inches, like 40.'),
  backingMargin: inches('Write inches, like 4.'),
  battingMargin: inches('Write inches, like 4.'),
});

export function toLayoutPlanInput(values: LayoutPlanValues, pick?: { rows: number; columns: number }): LayoutPlanInput {
  const text = (v: string) => (v.trim() ? v.trim() : undefined);
  const sashing = text(values.sashing);
  return {
    blockCount: Number(values.blockCount),
    blockWidth: values.blockWidth.trim(),
    blockHeight: values.blockHeight.trim(),
    ...(sashing ? { sashing, cornerstones: values.cornerstones } : {}),
    ...(sashing && values.sashingAround ? { sashingAround: true } : {}),
    borders: values.borders.map((b) => b.trim()).filter(Boolean),
    bindingWidth: text(values.bindingWidth),
    fabricWidth: text(values.fabricWidth),
    backingMargin: text(values.backingMargin),
    battingMargin: text(values.battingMargin),
    ...(pick ? { rows: pick.rows, columns: pick.columns } : {}),
  };
}

export const createLayoutPlan = (input: LayoutPlanInput) => api.post<LayoutPlanResult>('/layout-plans', input);

export function useCreateLayoutPlan() {
  return useMutation({ mutationFn: createLayoutPlan });
}
