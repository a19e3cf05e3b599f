import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders } from '@/testing/test-utils';
import type { SizeCheck } from '../api/get-size-checks';
import { readingFromCheck, SizeCheckPanel } from './size-check-panel';

const PHOTOS = 'POST /api/guilds/1/bees/2/rounds/2026-11/blocks/7/photos';
const MANUAL = 'POST /api/guilds/1/bees/2/rounds/2026-11/blocks/7/manual-size';

const base: SizeCheck = {
  id: 41,
  status: 'measured',
  failureReason: null,
  message: null,
  verdict: 'too_big',
  outOfSquare: false,
  summary: 'Too big by 3/16: trim it to 12 1/2 x 12 1/2 inches unfinished.',
  measured: { widthMm: 322.3, heightMm: 318.5, widthText: '12 11/16', heightText: '12 9/16' },
  manual: null,
  diagonalsMm: [452.1, 452.6],
  cornerAnglesDeg: [90.1, 89.9, 90.2, 89.8],
  printScale: 1,
  rulerReadingText: '6',
  onBehalf: false,
  createdAt: '2026-11-20T15:04:00.000Z',
  processingMs: 812,
  images: {
    display: '/api/guilds/1/size-checks/41/images/display',
    thumb: '/api/guilds/1/size-checks/41/images/thumb',
    overlay: '/api/guilds/1/size-checks/41/images/overlay',
    original: '/api/guilds/1/size-checks/41/images/original',
  },
};

function renderPanel(latest: SizeCheck | null = null) {
  return renderWithProviders(
    <SizeCheckPanel
      guildId="1"
      beeId="2"
      month="2026-11"
      membershipId={7}
      latest={latest}
      target={{ unfinished: '12 1/2 x 12 1/2', finished: '12 x 12' }}
    />,
  );
}

const photoFile = () => new File([new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 1, 2, 3])], 'block.jpg', { type: 'image/jpeg' });

async function choosePhotoAndMeasure(user: ReturnType<typeof renderPanel>['user']) {
  await user.upload(screen.getByLabelText('Take a photo'), photoFile());
  await user.click(screen.getByRole('button', { name: 'Measure the block' }));
}

describe('SizeCheckPanel', () => {
  it('explains the unfinished target and links both paper sizes of the card', () => {
    renderPanel();
    expect(screen.getByRole('heading', { name: 'Check the size before you send it' })).toBeInTheDocument();
    expect(screen.getByText('12 1/2 x 12 1/2 inches unfinished')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: /Print the reference card \(US Letter\)/ })).toHaveAttribute(
      'href',
      '/api/size-check/card.pdf?paper=letter',
    );
    expect(screen.getByRole('link', { name: /Print the reference card \(A4\)/ })).toHaveAttribute('target', '_blank');
    expect(screen.getByLabelText('Take a photo')).toHaveAttribute('capture', 'environment');
  });

  it('asks for a photo before it sends anything', async () => {
    const fetchMock = mockFetch({});
    const { user } = renderPanel();
    await user.click(screen.getByRole('button', { name: 'Measure the block' }));
    expect(await screen.findByText('Take a photo of your block first, or choose one.')).toBeInTheDocument();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('shows the ruler reading message under its field when the api needs it (400)', async () => {
    const fetchMock = mockFetch({
      [PHOTOS]: jsonResponse(400, {
        statusCode: 400,
        message: 'Please check the highlighted fields.',
        errors: { rulerReading: ['Measure the long bar on your printed card with your ruler and type what it reads.'] },
      }),
    });
    const { user } = renderPanel();
    await choosePhotoAndMeasure(user);

    const field = screen.getByLabelText(/What does your ruler read for the long bar\?/);
    await waitFor(() => expect(field).toHaveAttribute('aria-invalid', 'true'));
    expect(screen.getByText('Measure the long bar on your printed card with your ruler and type what it reads.')).toBeInTheDocument();
    expect(screen.getByText('Please check the highlighted fields.')).toBeInTheDocument();
    // Left empty, the reading is not sent, so the api can reuse her last one.
    const form = fetchMock.mock.calls[0][1]?.body as FormData;
    expect(form.get('rulerReading')).toBeNull();
    expect(form.get('rulerUnit')).toBe('in');
    expect(form.get('photo')).toBeInstanceOf(File);
  });

  it('shows a measured result: the verdict in words and the sizes, saying unfinished', async () => {
    const fetchMock = mockFetch({ [PHOTOS]: jsonResponse(201, base) });
    const { user } = renderPanel();
    await user.type(screen.getByLabelText(/What does your ruler read for the long bar\?/), '5 15/16');
    await choosePhotoAndMeasure(user);

    const result = await screen.findByTestId('size-check-result');
    expect(result).toHaveTextContent('Too big: trim it');
    expect(result).toHaveTextContent('Too big by 3/16: trim it to 12 1/2 x 12 1/2 inches unfinished.');
    expect(result).toHaveTextContent('12 11/16 x 12 9/16 inches unfinished (as it is now)');
    expect(screen.getByRole('img', { name: /with the edges Selvage measured drawn on it/ })).toHaveAttribute(
      'src',
      '/api/guilds/1/size-checks/41/images/overlay',
    );
    expect(screen.getByRole('status')).toHaveTextContent('Too big: trim it.');
    const form = fetchMock.mock.calls[0][1]?.body as FormData;
    expect(form.get('rulerReading')).toBe('5 15/16');
  });

  it('shows why a photo could not be measured and what to do', async () => {
    mockFetch({
      [PHOTOS]: jsonResponse(201, {
        ...base,
        status: 'failed',
        failureReason: 'markers_missing',
        message: 'Selvage could not find all four black squares of the card. Make sure the whole card is in the photo.',
        verdict: null,
        outOfSquare: null,
        summary: null,
        measured: null,
        images: { ...base.images, overlay: null },
      }),
    });
    const { user } = renderPanel();
    await user.type(screen.getByLabelText(/What does your ruler read for the long bar\?/), '6');
    await choosePhotoAndMeasure(user);

    expect(await screen.findByRole('heading', { name: 'Selvage could not measure this photo' })).toBeInTheDocument();
    const result = screen.getByTestId('size-check-result');
    expect(within(result).getByText(/could not find all four black squares/)).toBeInTheDocument();
    expect(screen.getByRole('status')).toHaveTextContent('Selvage could not measure the photo.');
    expect(screen.getByText('Take the photo again:')).toBeInTheDocument();
    expect(screen.getByRole('img', { name: /^Photo of your block/ })).toHaveAttribute('src', '/api/guilds/1/size-checks/41/images/display');
  });

  it('keeps the ruler figures beside the photo figures', async () => {
    const fetchMock = mockFetch({
      [MANUAL]: () =>
        jsonResponse(201, { ...base, manual: { widthMm: 317.5, heightMm: 317.5, widthText: '12 1/2', heightText: '12 1/2' } }),
    });
    const { user } = renderPanel(base);
    await user.type(screen.getByLabelText('Width, unfinished (inches)'), '12 1/2');
    await user.type(screen.getByLabelText('Height, unfinished (inches)'), '12.5');
    await user.click(screen.getByRole('button', { name: 'Save the ruler size' }));

    expect(await screen.findByText(/^Saved: 12 1\/2 x 12 1\/2 inches unfinished/)).toBeInTheDocument();
    const result = screen.getByTestId('size-check-result');
    expect(result).toHaveTextContent('From the photo');
    expect(result).toHaveTextContent('12 11/16 x 12 9/16 inches unfinished');
    expect(result).toHaveTextContent('Your ruler');
    expect(JSON.parse(String(fetchMock.mock.calls[0][1]?.body))).toEqual({ width: '12 1/2', height: '12.5' });
  });

  it('fills in the last reading, in the unit she measured', () => {
    expect(readingFromCheck(base)).toEqual({ rulerReading: '6', rulerUnit: 'in' });
    // 15.1 cm on the cm bar is a print scale of 1.00667 and 5 15/16 inches.
    expect(readingFromCheck({ ...base, rulerReadingText: '5 15/16', printScale: 1.006667 })).toEqual({ rulerReading: '15.1', rulerUnit: 'cm' });
    expect(readingFromCheck(null)).toEqual({ rulerReading: '', rulerUnit: 'in' });
  });
});
