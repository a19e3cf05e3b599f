import type { QueryKey } from '@tanstack/react-query';
import { Form as FormikForm, Formik, type FormikHelpers } from 'formik';
import { useEffect, useId, useRef, useState } from 'react';
import Form from 'react-bootstrap/Form';
import Spinner from 'react-bootstrap/Spinner';
import { useDropzone, type FileRejection } from 'react-dropzone';
import * as yup from 'yup';
import { RadioGroupField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors, type FormStatus } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { isApiError } from '@/lib/api-client';
import { parseInches } from '@/lib/inches';
import type { SizeCheck } from '../api/get-size-checks';
import { referenceCardHref } from '../api/reference-card';
import { manualSizeSchema, useSaveManualSize, type ManualSizeInput } from '../api/save-manual-size';
import { PHOTO_MAX_BYTES, PHOTO_TYPES, useUploadSizePhoto, type RulerUnit } from '../api/upload-size-photo';
import { shrinkPhoto } from '../lib/shrink-photo';
import { checkedSizeText } from './verdict';
import { resultAnnouncement, SizeCheckResult } from './size-check-result';

type HeadingLevel = 3 | 4;

/** The round's target sizes as texts, e.g. "12 1/2 x 12 1/2". */
export type SizeTarget = { unfinished: string; finished: string; untrimmed?: boolean };

export type SizeCheckPanelProps = {
  guildId: string;
  beeId: string;
  month: string;
  membershipId: number;
  /** The block's latest check, from the round page. */
  latest: SizeCheck | null | undefined;
  target: SizeTarget | null;
  /** Set when the organiser checks a maker's block on her behalf. */
  makerName?: string;
  headingLevel?: HeadingLevel;
  timeZone?: string;
  /** Queries that show the latest check and should refresh after a new one (the round page). */
  alsoInvalidate?: readonly QueryKey[];
};

type ReadingValues = { rulerReading: string; rulerUnit: RulerUnit };

const CARD_INCH_BAR_MM = 6 * 25.4;
const CARD_CM_BAR_MM = 150;

/**
 * The reading to fill in from her last check. The api gives the reading in inches and the print
 * scale it implied; from the two we can tell which bar she measured and show it her way.
 */
export function readingFromCheck(check: SizeCheck | null | undefined): ReadingValues {
  const text = check?.rulerReadingText?.trim();
  if (!text) return { rulerReading: '', rulerUnit: 'in' };
  const inches = parseInches(text);
  if (inches !== null && check?.printScale && check.printScale > 0) {
    const barMm = (inches * 25.4) / check.printScale;
    if (Math.abs(barMm - CARD_CM_BAR_MM) < Math.abs(barMm - CARD_INCH_BAR_MM)) {
      const cm = Math.round(15 * check.printScale * 10) / 10;
      return { rulerReading: String(cm), rulerUnit: 'cm' };
    }
  }
  return { rulerReading: text, rulerUnit: 'in' };
}

const readingSchema = yup.object({
  rulerUnit: yup.string().oneOf(['in', 'cm'], 'Choose the bar you measured.').required('Choose the bar you measured.'),
  rulerReading: yup
    .string()
    .trim()
    .max(20, 'Type just the number your ruler reads.')
    .test('reading', function check(value) {
      if (!value) return true;
      if (this.parent.rulerUnit === 'cm') {
        const cm = Number(value.replace(',', '.').replace(/\s*cm$/i, ''));
        return Number.isFinite(cm) && cm > 0 ? true : this.createError({ message: 'Type what your ruler reads in centimetres, like 15 or 14.9.' });
      }
      const inches = parseInches(value);
      return inches !== null && inches > 0 ? true : this.createError({ message: 'Type what your ruler reads in inches, like 6 or 5 15/16.' });
    }),
});

const UNIT_OPTIONS = [
  { value: 'in', label: 'I measured the 6 inch bar (inches)' },
  { value: 'cm', label: 'I measured the 15 cm bar (centimetres)' },
] as const;

export const PHOTO_TIPS = [
  'Lay the block flat and smooth it out.',
  'Put the printed card beside the block on the same table or floor, not on top of it.',
  'Use a background that is darker or lighter than the block.',
  'Hold the phone straight above, so the whole block and the whole card are in the picture.',
  'Light it evenly, without shadows from you or the phone.',
];

const objectUrl = (file: Blob | null) =>
  file && typeof URL !== 'undefined' && typeof URL.createObjectURL === 'function' ? URL.createObjectURL(file) : null;

function isAcceptedPhoto(file: File): boolean {
  return (PHOTO_TYPES as readonly string[]).includes(file.type);
}

export function SizeCheckPanel({
  guildId,
  beeId,
  month,
  membershipId,
  latest,
  target,
  makerName,
  headingLevel = 3,
  timeZone,
  alsoInvalidate = [],
}: SizeCheckPanelProps) {
  const id = useId();
  const H = `h${headingLevel}` as 'h3';
  const Sub = `h${headingLevel + 1}` as 'h4';
  const upload = useUploadSizePhoto(guildId, beeId, month, membershipId, alsoInvalidate);
  const manual = useSaveManualSize(guildId, beeId, month, membershipId, alsoInvalidate);
  const [result, setResult] = useState<SizeCheck | null>(null);
  const [photo, setPhoto] = useState<File | null>(null);
  const [preview, setPreview] = useState<string | null>(null);
  const [photoProblem, setPhotoProblem] = useState('');
  const [announcement, setAnnouncement] = useState('');
  const pickerRef = useRef<HTMLInputElement>(null);
  const shown = result ?? latest ?? null;
  const her = makerName ? `${makerName}'s` : 'your';
  const initialReading = readingFromCheck(latest);

  useEffect(() => {
    const url = objectUrl(photo);
    setPreview(url);
    return () => {
      if (url) URL.revokeObjectURL(url);
    };
  }, [photo]);

  const choose = (file: File | undefined) => {
    setAnnouncement('');
    if (!file) return;
    if (!isAcceptedPhoto(file)) {
      setPhoto(null);
      setPhotoProblem('That file is not a JPEG or PNG photo. Take a photo, or choose a JPEG or PNG picture.');
      return;
    }
    setPhotoProblem('');
    setPhoto(file);
    setAnnouncement('Photo chosen. It is ready to measure.');
  };

  const dropzone = useDropzone({
    accept: { 'image/jpeg': ['.jpg', '.jpeg'], 'image/png': ['.png'] },
    multiple: false,
    noClick: true,
    noKeyboard: true,
    onDrop: (accepted: File[], rejected: FileRejection[]) => {
      if (accepted[0]) choose(accepted[0]);
      else if (rejected.length) choose(rejected[0].file);
    },
  });

  const measure = async (values: ReadingValues, helpers: FormikHelpers<ReadingValues>) => {
    helpers.setStatus(undefined);
    setAnnouncement('');
    if (!photo) {
      setPhotoProblem(`Take a photo of ${her} block first, or choose one.`);
      pickerRef.current?.focus();
      return;
    }
    setPhotoProblem('');
    const small = await shrinkPhoto(photo);
    if (small.size > PHOTO_MAX_BYTES) {
      setPhotoProblem('That photo is larger than 20 MB. Take it again with a smaller picture size.');
      return;
    }
    try {
      const check = await upload.mutateAsync({ photo: small, rulerReading: values.rulerReading, rulerUnit: values.rulerUnit });
      setResult(check);
      setPhoto(null);
      if (pickerRef.current) pickerRef.current.value = '';
      setAnnouncement(resultAnnouncement(check));
    } catch (error) {
      if (isApiError(error) && error.errors.photo?.length) {
        // Photo problems go beside the picker; the rest (the ruler reading) under its own field.
        const { photo: photoMessages, ...rest } = error.errors;
        setPhotoProblem(photoMessages.join(' '));
        helpers.setErrors(Object.fromEntries(Object.entries(rest).map(([k, v]) => [k, v.join(' ')])));
        if (Object.keys(rest).length) helpers.setStatus({ error: error.message } satisfies FormStatus);
        else pickerRef.current?.focus();
      } else {
        applyServerErrors(error, helpers, values);
      }
      setAnnouncement('');
    }
  };

  const saveManual = async (values: ManualSizeInput, helpers: FormikHelpers<ManualSizeInput>) => {
    helpers.setStatus(undefined);
    try {
      const check = await manual.mutateAsync(values);
      setResult(check);
      const size = checkedSizeText(check.manual);
      helpers.setStatus({ success: `Saved: ${size ?? `${values.width} x ${values.height}`} inches unfinished, from ${makerName ? 'the' : 'your'} ruler.` } satisfies FormStatus);
    } catch (error) {
      applyServerErrors(error, helpers, values);
    }
  };

  return (
    <section className="size-check" aria-labelledby={`${id}-heading`} data-testid="size-check-panel">
      <H id={`${id}-heading`} className={headingLevel === 3 ? 'h4 mb-2' : 'h5 mb-2'}>
        Check the size before you send it
        {makerName && <span className="visually-hidden"> ({makerName})</span>}
      </H>
      <p>
        Take a photo of {her} block beside Selvage's printed card. Selvage measures the block as it is now, against this
        round's <strong>unfinished</strong> size
        {target ? (
          <>
            : <strong>{target.unfinished} inches unfinished</strong> ({target.finished} inches finished, once it is sewn into the
            quilt).
          </>
        ) : (
          '.'
        )}
        {target?.untrimmed && ' The queen trims the blocks herself this round, so a little too big is fine.'}
      </p>

      <Sub className="h6 fw-bold mt-3">1. Print the card</Sub>
      <p className="mb-1">Print it at 100% (“actual size”), with “fit to page” turned off. One printed card does for every month.</p>
      <ul className="plain-list d-flex flex-wrap column-gap-4 mb-3">
        <li>
          <a href={referenceCardHref('letter')} target="_blank" rel="noopener noreferrer" className="tap-link">
            Print the reference card (US Letter)<span className="visually-hidden"> (opens in a new tab)</span>
          </a>
        </li>
        <li>
          <a href={referenceCardHref('a4')} target="_blank" rel="noopener noreferrer" className="tap-link">
            Print the reference card (A4)<span className="visually-hidden"> (opens in a new tab)</span>
          </a>
        </li>
      </ul>

      <Formik<ReadingValues> initialValues={initialReading} validationSchema={readingSchema} onSubmit={measure}>
        {({ isSubmitting, values }) => (
          <FormikForm noValidate aria-label={makerName ? `Measure ${makerName}'s block from a photo` : 'Measure my block from a photo'}>
            <Sub className="h6 fw-bold mt-3">2. Measure the card with your ruler</Sub>
            <RadioGroupField name="rulerUnit" legend="Which bar did you measure?" options={UNIT_OPTIONS} />
            <TextField
              name="rulerReading"
              label="What does your ruler read for the long bar?"
              optional={Boolean(initialReading.rulerReading)}
              inputMode="decimal"
              autoComplete="off"
              help={
                <>
                  {values.rulerUnit === 'cm' ? 'For example 15 or 14.9.' : 'For example 6 or 5 15/16.'} You only need to do this once
                  for each printed card.
                  {initialReading.rulerReading ? ' Filled in from the last photo.' : ' After the first photo, Selvage remembers it.'}
                </>
              }
            />

            <Sub className="h6 fw-bold mt-3">3. Take the photo</Sub>
            <ul className="photo-tips">
              {PHOTO_TIPS.map((tip) => (
                <li key={tip}>{tip}</li>
              ))}
            </ul>

            <div className="photo-picker mb-3">
              <input
                ref={pickerRef}
                id={`${id}-photo`}
                type="file"
                accept="image/jpeg,image/png"
                capture="environment"
                className="visually-hidden photo-input"
                aria-describedby={`${id}-photo-help${photoProblem ? ` ${id}-photo-problem` : ''}`}
                aria-invalid={photoProblem ? true : undefined}
                onChange={(e) => choose(e.currentTarget.files?.[0])}
              />
              <label htmlFor={`${id}-photo`} className="btn btn-primary btn-lg photo-button">
                <svg width="26" height="26" viewBox="0 0 24 24" aria-hidden="true" focusable="false" className="me-2">
                  <path
                    d="M4 7h3l2-3h6l2 3h3a1 1 0 0 1 1 1v11a1 1 0 0 1-1 1H4a1 1 0 0 1-1-1V8a1 1 0 0 1 1-1z"
                    fill="none"
                    stroke="currentColor"
                    strokeWidth="2"
                    strokeLinejoin="round"
                  />
                  <circle cx="12" cy="13" r="4" fill="none" stroke="currentColor" strokeWidth="2" />
                </svg>
                {photo ? 'Take a different photo' : 'Take a photo'}
              </label>
              <Form.Text id={`${id}-photo-help`} className="d-block">
                A JPEG or PNG photo. Selvage makes it smaller before it sends it.
              </Form.Text>
              {photoProblem && (
                <p id={`${id}-photo-problem`} className="text-danger fw-bold mt-2 mb-0">
                  {photoProblem}
                </p>
              )}
              <div
                {...dropzone.getRootProps({
                  className: `photo-dropzone d-none d-md-flex mt-3${dropzone.isDragActive ? ' is-active' : ''}`,
                })}
              >
                <input {...dropzone.getInputProps({ 'aria-label': 'Photo dropped here' })} />
                <p className="mb-0">
                  {dropzone.isDragActive ? 'Let go to use this photo.' : 'On a computer, you can also drag a photo here from a folder.'}
                </p>
              </div>
            </div>

            {preview && photo && (
              <figure className="size-photo photo-preview mb-3">
                <img src={preview} alt={`The photo you chose of ${her} block`} />
                <figcaption className="text-body-secondary">Ready to measure.</figcaption>
              </figure>
            )}

            <FormAlert />
            <SubmitButton busyLabel="Measuring">Measure the block</SubmitButton>
            <div role="status" aria-live="polite" className={isSubmitting ? 'measuring mt-3' : 'visually-hidden'}>
              {isSubmitting ? (
                <>
                  <Spinner animation="border" size="sm" aria-hidden="true" className="me-2" />
                  Measuring… this takes a few seconds.
                </>
              ) : (
                announcement
              )}
            </div>
          </FormikForm>
        )}
      </Formik>

      {shown && (
        <div className="mt-4">
          <SizeCheckResult check={shown} headingLevel={(headingLevel + 1) as 4 | 5} makerName={makerName} timeZone={timeZone} />
        </div>
      )}

      <Sub className="h6 fw-bold mt-4">Or type what {makerName ? 'the' : 'your'} ruler says</Sub>
      <p className="mb-2">
        Measure the block edge to edge as it is now (unfinished, with the seam allowance on every side).
        {shown?.measured ? ' Both figures are kept, side by side.' : ''}
      </p>
      <Formik<ManualSizeInput>
        initialValues={{ width: shown?.manual?.widthText ?? '', height: shown?.manual?.heightText ?? '' }}
        validationSchema={manualSizeSchema}
        onSubmit={saveManual}
      >
        <FormikForm noValidate aria-label={makerName ? `Type ${makerName}'s block size` : 'Type my block size'}>
          <FormAlert />
          <div className="row g-3">
            <div className="col-12 col-sm-6">
              <TextField name="width" label="Width, unfinished (inches)" inputMode="decimal" autoComplete="off" className="mb-0" />
            </div>
            <div className="col-12 col-sm-6">
              <TextField name="height" label="Height, unfinished (inches)" inputMode="decimal" autoComplete="off" className="mb-0" />
            </div>
          </div>
          <Form.Text className="d-block mb-3">Like 12 1/2 or 12.5.</Form.Text>
          <SubmitButton busyLabel="Saving">Save the ruler size</SubmitButton>
        </FormikForm>
      </Formik>

      <p className="safety-note mt-4 mb-0">
        <strong>Stay safe:</strong> close the rotary cutter after every cut, and unplug the iron when you are done.
      </p>
    </section>
  );
}
