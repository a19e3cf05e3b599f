import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import Button from 'react-bootstrap/Button';
import Form from 'react-bootstrap/Form';
import { shrinkPhoto } from '@/features/size-check/lib/shrink-photo';
import { isApiError } from '@/lib/api-client';
import { ENTRY_PHOTO_MAX_BYTES, ENTRY_PHOTO_TYPES } from '../api/upload-entry-photo';

type EntryPhotoUploadProps = {
  title: string;
  hasPhoto: boolean;
  onUpload: (photo: Blob) => Promise<unknown>;
};

/** Bad request, too large, not a type it takes, cannot be read. */
const FILE_REFUSALS = [400, 413, 415, 422];

const objectUrl = (file: Blob | null) =>
  file && typeof URL !== 'undefined' && typeof URL.createObjectURL === 'function' ? URL.createObjectURL(file) : null;

/** Choose a photo of the quilt, see it, then send it. JPEG or PNG up to 20 MB; the server's word is shown as it is. */
export function EntryPhotoUpload({ title, hasPhoto, onUpload }: EntryPhotoUploadProps) {
  const id = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  const [photo, setPhoto] = useState<File | null>(null);
  const [preview, setPreview] = useState<string | null>(null);
  const [problem, setProblem] = useState('');
  const [done, setDone] = useState('');
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    const url = objectUrl(photo);
    setPreview(url);
    return () => {
      if (url) URL.revokeObjectURL(url);
    };
  }, [photo]);

  const choose = (file: File | undefined) => {
    setDone('');
    setProblem('');
    if (!file) return setPhoto(null);
    if (!(ENTRY_PHOTO_TYPES as readonly string[]).includes(file.type)) {
      setPhoto(null);
      setProblem('That file is not a JPEG or PNG photo. Choose a JPEG or PNG picture.');
      return;
    }
    if (file.size > ENTRY_PHOTO_MAX_BYTES) {
      setPhoto(null);
      setProblem('That photo is larger than 20 MB. Choose a smaller one.');
      return;
    }
    setPhoto(file);
  };

  /** A refused file is let go, so only the refusal stays and the picker takes a new one. */
  const drop = (message: string) => {
    setPhoto(null);
    setProblem(message);
    if (inputRef.current) inputRef.current.value = '';
  };

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    setDone('');
    if (!photo) {
      setProblem('Choose a photo first.');
      inputRef.current?.focus();
      return;
    }
    setBusy(true);
    setProblem('');
    try {
      await onUpload(await shrinkPhoto(photo));
      setPhoto(null);
      if (inputRef.current) inputRef.current.value = '';
      setDone('The photo is saved.');
    } catch (error) {
      if (!isApiError(error)) setProblem('Something went wrong. Please try again.');
      else {
        const message = [...(error.errors.photo ?? []), ...(error.errors.photo ? [] : [error.message])].join(' ');
        // Refused for what the file is: it is let go. Anything else (busy, signed out, a fault) may pass, so it stays to send again.
        if (error.errors.photo || FILE_REFUSALS.includes(error.status)) {
          drop(message);
          inputRef.current?.focus();
        } else setProblem(message);
      }
    } finally {
      setBusy(false);
    }
  };

  return (
    <Form onSubmit={submit} noValidate aria-label={`Photo of ${title}`} className="entry-photo-form">
      <Form.Group controlId={id} className="mb-2">
        <Form.Label>{hasPhoto ? 'Change the photo' : 'Add a photo of your quilt'}</Form.Label>
        <Form.Control
          ref={inputRef}
          type="file"
          accept={ENTRY_PHOTO_TYPES.join(',')}
          onChange={(e) => choose((e.currentTarget as HTMLInputElement).files?.[0])}
          isInvalid={Boolean(problem)}
          aria-describedby={`${id}-help${problem ? ` ${id}-problem` : ''}`}
        />
        <Form.Text id={`${id}-help`} className="d-block">
          A JPEG or PNG photo of the whole quilt, up to 20 MB. It is shown on the ballot.
        </Form.Text>
      </Form.Group>
      {preview && photo && (
        <figure className="entry-photo photo-preview mb-2">
          <img
            src={preview}
            alt={`The photo you chose of ${title}`}
            onError={() => drop('That file is not a photo Selvage can read. Choose a JPEG or PNG picture.')}
          />
          <figcaption className="text-body-secondary">Not sent yet. Press “Upload the photo”.</figcaption>
        </figure>
      )}
      <div role="status" aria-live="polite">
        {problem && (
          <p id={`${id}-problem`} className="text-danger fw-bold mb-2">
            {problem}
          </p>
        )}
        {done && <p className="text-success fw-bold mb-2">{done}</p>}
      </div>
      <Button type="submit" variant="outline-primary" disabled={busy}>
        {busy ? 'Uploading…' : 'Upload the photo'}
      </Button>
    </Form>
  );
}
