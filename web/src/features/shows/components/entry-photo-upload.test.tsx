import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '@/lib/api-client';
import { EntryPhotoUpload } from './entry-photo-upload';

const NOT_SENT = 'Not sent yet. Press “Upload the photo”.';

function renderUpload(onUpload = vi.fn().mockResolvedValue({})) {
  const user = userEvent.setup();
  render(<EntryPhotoUpload title="Winter Barn" hasPhoto={false} onUpload={onUpload} />);
  const input = screen.getByLabelText('Add a photo of your quilt') as HTMLInputElement;
  const choose = (file: File) => fireEvent.change(input, { target: { files: [file] } });
  return { user, input, choose, onUpload };
}

// A text file renamed .jpg: the browser takes its word for the type.
const fakeJpeg = () => new File(['just some notes'], 'winter-barn.jpg', { type: 'image/jpeg' });

describe('EntryPhotoUpload', () => {
  beforeEach(() => {
    // jsdom has no object URLs; the preview needs one.
    URL.createObjectURL = vi.fn(() => 'blob:winter-barn');
    URL.revokeObjectURL = vi.fn();
  });
  afterEach(() => {
    delete (URL as { createObjectURL?: unknown }).createObjectURL;
    delete (URL as { revokeObjectURL?: unknown }).revokeObjectURL;
  });

  it('lets go of a file the browser cannot show as a picture, keeping only the refusal', async () => {
    const { choose, input, onUpload } = renderUpload();
    choose(fakeJpeg());
    expect(screen.getByText(NOT_SENT)).toBeInTheDocument();
    fireEvent.error(screen.getByRole('img', { name: 'The photo you chose of Winter Barn' }));
    expect(screen.queryByRole('img')).not.toBeInTheDocument();
    expect(screen.queryByText(NOT_SENT)).not.toBeInTheDocument();
    expect(input).toHaveAccessibleDescription(/That file is not a photo Selvage can read\. Choose a JPEG or PNG picture\./);
    expect(input).toHaveValue('');
    expect(onUpload).not.toHaveBeenCalled();
  });

  it('drops the preview when the server refuses the photo, and takes another', async () => {
    const refusal = 'That file is not a photo Selvage can read. Upload a JPEG or PNG picture.';
    const onUpload = vi.fn().mockRejectedValueOnce(new ApiError(400, 'Please check the form.', { photo: [refusal] }));
    const { user, choose, input } = renderUpload(onUpload);
    choose(fakeJpeg());
    await user.click(screen.getByRole('button', { name: 'Upload the photo' }));
    expect(await screen.findByText(refusal)).toBeInTheDocument();
    expect(screen.queryByRole('img')).not.toBeInTheDocument();
    expect(screen.queryByText(NOT_SENT)).not.toBeInTheDocument();
    await waitFor(() => expect(input).toHaveFocus());

    choose(new File(['png bytes'], 'winter-barn.png', { type: 'image/png' }));
    expect(screen.queryByText(refusal)).not.toBeInTheDocument();
    expect(screen.getByText(NOT_SENT)).toBeInTheDocument();
  });

  it('keeps the photo to send again when the trouble was not the file', async () => {
    const onUpload = vi.fn().mockRejectedValueOnce(new ApiError(503, 'Something went wrong. Please try again.'));
    const { user, choose } = renderUpload(onUpload);
    choose(fakeJpeg());
    await user.click(screen.getByRole('button', { name: 'Upload the photo' }));
    expect(await screen.findByText('Something went wrong. Please try again.')).toBeInTheDocument();
    expect(screen.getByText(NOT_SENT)).toBeInTheDocument();
  });
});
