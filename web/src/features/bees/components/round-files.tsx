import { useId, useRef, useState, type FormEvent } from 'react';
import Button from 'react-bootstrap/Button';
import Form from 'react-bootstrap/Form';
import { ErrorAlert } from '@/components/ui/error-alert';
import type { RoundFile } from '../api/get-round';
import { roundFileHref, useDeleteRoundFile } from '../api/delete-round-file';
import { ROUND_FILE_MAX_BYTES, ROUND_FILE_TYPES, useUploadRoundFile } from '../api/upload-round-file';

function fileKind(contentType: string): string {
  if (contentType === 'application/pdf') return 'PDF';
  if (contentType.startsWith('image/')) return `${contentType.slice(6).toUpperCase()} picture`;
  return 'file';
}

export function fileSize(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
  if (bytes >= 1024) return `${Math.round(bytes / 1024)} KB`;
  return `${bytes} bytes`;
}

type RoundFilesProps = {
  guildId: string;
  beeId: string;
  month: string;
  files: RoundFile[];
  canEdit: boolean;
};

export function RoundFiles({ guildId, beeId, month, files, canEdit }: RoundFilesProps) {
  const remove = useDeleteRoundFile(guildId, beeId, month);
  if (files.length === 0) return canEdit ? <p>No files yet.</p> : null;
  return (
    <>
      <ErrorAlert error={remove.error} />
      <ul className="plain-list file-list" aria-label="Pattern files">
        {files.map((file) => (
          <li key={file.id} className="d-flex flex-wrap align-items-center gap-2 py-1">
            <a href={roundFileHref(guildId, beeId, month, file.id)} target="_blank" rel="noopener noreferrer" className="tap-link break-anywhere">
              {file.filename}
              <span className="visually-hidden"> (opens in a new tab)</span>
            </a>
            <span className="text-body-secondary">
              {fileKind(file.contentType)}, {fileSize(file.size)}
            </span>
            {canEdit && (
              <Button variant="outline-danger" size="sm" disabled={remove.isPending} onClick={() => remove.mutate(file.id)}>
                Delete<span className="visually-hidden"> {file.filename}</span>
              </Button>
            )}
          </li>
        ))}
      </ul>
    </>
  );
}

export function UploadRoundFile({ guildId, beeId, month }: { guildId: string; beeId: string; month: string }) {
  const upload = useUploadRoundFile(guildId, beeId, month);
  const inputRef = useRef<HTMLInputElement>(null);
  const [problem, setProblem] = useState('');
  const [done, setDone] = useState('');
  const id = useId();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setProblem('');
    setDone('');
    const file = inputRef.current?.files?.[0];
    if (!file) {
      setProblem('Choose a file first.');
      return;
    }
    if (file.size > ROUND_FILE_MAX_BYTES) {
      setProblem('That file is larger than 20 MB. Try a smaller PDF or picture.');
      return;
    }
    upload.mutate(file, {
      onSuccess: () => {
        setDone(`${file.name} is uploaded.`);
        if (inputRef.current) inputRef.current.value = '';
      },
    });
  };

  return (
    <Form onSubmit={submit} noValidate aria-label="Add a pattern file">
      <Form.Group controlId={id} className="mb-3">
        <Form.Label>Pattern file</Form.Label>
        <Form.Control
          ref={inputRef}
          type="file"
          accept={ROUND_FILE_TYPES.join(',')}
          aria-describedby={`${id}-help`}
          isInvalid={Boolean(problem)}
        />
        <Form.Text id={`${id}-help`} className="d-block">
          A PDF or a picture (PNG, JPEG, GIF or WebP), up to 20 MB.
        </Form.Text>
      </Form.Group>
      <div role="status" aria-live="polite">
        {problem && <p className="text-danger fw-bold">{problem}</p>}
        {done && <p className="text-success fw-bold">{done}</p>}
      </div>
      <ErrorAlert error={upload.error} />
      <Button type="submit" variant="outline-primary" disabled={upload.isPending}>
        {upload.isPending ? 'Uploading…' : 'Upload the file'}
      </Button>
    </Form>
  );
}
