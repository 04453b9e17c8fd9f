import { QueryClientProvider } from '@tanstack/react-query';
import { act, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type Konva from 'konva';
import { createRef } from 'react';
import { Layer, Stage } from 'react-konva';
import { describe, expect, it, vi } from 'vitest';
import type { Underlay } from '../../src/features/underlay/api/underlay.schema';
import { UnderlayImage } from '../../src/features/underlay/components/underlay-image.component';
import { UnderlayPanel, type UnderlayPanelProps } from '../../src/features/underlay/components/underlay-panel.component';
import { jsonResponse, testQueryClient } from '../../src/testing/test-utils';

// pdfjs cannot draw in jsdom: the page renderer stands in here (the browser spec draws for real).
const pdfPages = vi.hoisted(() => ({ calls: [] as [string, number][] }));
vi.mock('../../src/features/underlay/lib/pdf-page-image', () => ({
  pdfPageImageUrl: async (url: string, page: number) => {
    pdfPages.calls.push([url, page]);
    return `blob:rendered-page-${page}`;
  },
}));

const SCHEME = '0b5d2c7e-1111-4a2b-9c3d-222222222222';

function underlay(overrides: Partial<Underlay> = {}): Underlay {
  return {
    id: 'u-1',
    schemeId: SCHEME,
    levelId: 'L2',
    filename: 'level-2-arch.png',
    mime: 'image/png',
    bytes: 482_113,
    width_px: 2400,
    height_px: 1600,
    placement: { origin_ft: [0, 80], scale_ft_per_px: 0.05, rotation_deg: 0 },
    opacity: 0.5,
    visible: true,
    page: null,
    pageCount: null,
    locked: false,
    imageUrl: '/api/underlays/u-1/image',
    createdBy: 'u-eng',
    createdAt: '2025-01-01T00:00:00.000Z',
    updatedAt: '2025-01-01T00:00:00.000Z',
    ...overrides,
  };
}

type Call = { url: string; method: string; body: BodyInit | null | undefined };

/** A fetch stand-in: GET answers the list; PATCH echoes the change; POST answers `upload`. */
function stubServer(list: Underlay[], upload?: Response) {
  const calls: Call[] = [];
  const fetchMock = vi.fn(async (url: string, init?: RequestInit) => {
    const method = init?.method ?? 'GET';
    calls.push({ url, method, body: init?.body });
    if (method === 'GET') return jsonResponse(200, { underlays: list });
    if (method === 'PATCH') {
      const id = url.split('/').pop()!;
      const patch = JSON.parse(String(init!.body));
      const current = list.find((u) => u.id === id)!;
      return jsonResponse(200, { underlay: { ...current, ...patch, placement: { ...current.placement, ...(patch.placement ?? {}) } } });
    }
    if (method === 'DELETE') return new Response(null, { status: 204 });
    return upload ?? jsonResponse(500, {});
  });
  vi.stubGlobal('fetch', fetchMock);
  return calls;
}

function renderPanel(props: Partial<UnderlayPanelProps> = {}) {
  const client = testQueryClient();
  render(
    <QueryClientProvider client={client}>
      <UnderlayPanel schemeId={SCHEME} levelId="L2" canEdit units="US" {...props} />
    </QueryClientProvider>,
  );
  return client;
}

describe('UnderlayPanel', () => {
  it("when the scheme has underlays on two levels, then only this level's are listed with size and scale", async () => {
    stubServer([underlay(), underlay({ id: 'u-2', levelId: 'L3', filename: 'level-3.png' })]);
    renderPanel();
    expect(await screen.findByText('level-2-arch.png')).toBeInTheDocument();
    expect(screen.queryByText('level-3.png')).not.toBeInTheDocument();
    expect(screen.getByText('2400 × 1600 px · 471 kB')).toBeInTheDocument(); // 482 113 B / 1024, rounded
    expect(screen.getByText(/1 px = 0\.0500 ft/)).toBeInTheDocument();
  });

  it('when a PNG is chosen, then it is posted as multipart (file, level) and the new underlay is listed', async () => {
    const created = underlay({ id: 'u-9', filename: 'new-plan.png' });
    const calls = stubServer([], jsonResponse(201, { underlay: created }));
    renderPanel();
    await screen.findByText(/No drawing under this level yet/);
    const file = new File([new Uint8Array([0x89, 0x50, 0x4e, 0x47])], 'new-plan.png', { type: 'image/png' });
    await userEvent.upload(screen.getByLabelText('Upload a plan (image or PDF)'), file);
    expect(await screen.findByText('new-plan.png')).toBeInTheDocument();
    const post = calls.find((c) => c.method === 'POST')!;
    expect(post.url).toBe(`/api/schemes/${SCHEME}/underlays`);
    const form = post.body as FormData;
    expect(form.get('level')).toBe('L2');
    expect((form.get('file') as File).name).toBe('new-plan.png');
  });

  it('when the server refuses the file (415), then its message is shown', async () => {
    stubServer([], jsonResponse(415, { error: { code: 'unsupported_media_type', message: 'The file is not a PNG or JPEG image (its content was checked, not its name).' } }));
    renderPanel();
    await screen.findByText(/No drawing under this level yet/);
    await userEvent.upload(screen.getByLabelText('Upload a plan (image or PDF)'), new File(['hello'], 'fake.png', { type: 'image/png' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('The file is not a PNG or JPEG image');
  });

  it('when a file over 10 MB is chosen, then it is refused before any upload', async () => {
    const calls = stubServer([]);
    renderPanel();
    await screen.findByText(/No drawing under this level yet/);
    const big = new File([new Uint8Array(10 * 1024 * 1024 + 1)], 'scan.jpg', { type: 'image/jpeg' });
    await userEvent.upload(screen.getByLabelText('Upload a plan (image or PDF)'), big);
    expect(await screen.findByRole('alert')).toHaveTextContent('scan.jpg is 10.0 MB; the largest file accepted is 10 MB.');
    expect(calls.filter((c) => c.method === 'POST')).toEqual([]);
  });

  it('when Show is unticked, then visible: false is sent for that underlay', async () => {
    const calls = stubServer([underlay()]);
    renderPanel();
    await userEvent.click(await screen.findByRole('checkbox', { name: 'Show' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'PATCH')).toBe(true));
    const patch = calls.find((c) => c.method === 'PATCH')!;
    expect(patch.url).toBe('/api/underlays/u-1');
    expect(JSON.parse(String(patch.body))).toEqual({ visible: false });
  });

  it('when calibrated with A (100, 200), B (400, 600), 25 ft and A at plan (10, 20), then scale 0.05 ft/px and origin (5, 30) are saved', async () => {
    const calls = stubServer([underlay()]);
    renderPanel();
    await userEvent.click(await screen.findByRole('button', { name: 'Calibrate' }));
    const dialog = screen.getByRole('dialog', { name: /Calibrate level-2-arch.png/ });
    const d = within(dialog);
    await userEvent.type(d.getByLabelText('A: x (px)'), '100');
    await userEvent.type(d.getByLabelText('A: y (px)'), '200');
    await userEvent.type(d.getByLabelText('B: x (px)'), '400');
    await userEvent.type(d.getByLabelText('B: y (px)'), '600');
    await userEvent.type(d.getByLabelText(/Real distance A–B \(ft\)/), `25'-0"`);
    await userEvent.type(d.getByLabelText(/Plan x of A/), '10');
    await userEvent.type(d.getByLabelText(/Plan y of A/), '20');
    await userEvent.click(d.getByRole('button', { name: 'Save calibration' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    const body = JSON.parse(String(calls.find((c) => c.method === 'PATCH')!.body));
    // 500 px between the picks (3-4-5 triangle), 25 ft: 0.05 ft/px; origin = (10 − 100·0.05, 20 + 200·0.05).
    expect(body.placement.scale_ft_per_px).toBeCloseTo(0.05, 12);
    expect(body.placement.origin_ft[0]).toBeCloseTo(5, 9);
    expect(body.placement.origin_ft[1]).toBeCloseTo(30, 9);
    expect(body.placement.rotation_deg).toBe(0);
  });

  it('when calibration inputs are missing, then each field says what is needed and nothing is sent', async () => {
    const calls = stubServer([underlay()]);
    renderPanel();
    await userEvent.click(await screen.findByRole('button', { name: 'Calibrate' }));
    const d = within(screen.getByRole('dialog'));
    await userEvent.click(d.getByRole('button', { name: 'Save calibration' }));
    expect(d.getByLabelText('A: x (px)')).toHaveAccessibleDescription('Pick point A on the image or type its pixel x and y');
    expect(d.getByLabelText(/Real distance/)).toHaveAccessibleDescription('Enter a value in ft');
    expect(calls.filter((c) => c.method === 'PATCH')).toEqual([]);
  });

  it('when the canvas can pick, then "Pick on the plan" hands the underlay over', async () => {
    stubServer([underlay()]);
    const onPick = vi.fn();
    renderPanel({ onPickCalibration: onPick });
    await userEvent.click(await screen.findByRole('button', { name: 'Pick on the plan' }));
    expect(onPick).toHaveBeenCalledWith(expect.objectContaining({ id: 'u-1', width_px: 2400 }));
  });

  it('when Delete is confirmed, then the underlay is deleted and leaves the list', async () => {
    const calls = stubServer([underlay()]);
    renderPanel();
    await userEvent.click(await screen.findByRole('button', { name: 'Delete…' }));
    await userEvent.click(screen.getByRole('button', { name: 'Delete level-2-arch.png' }));
    await waitFor(() => expect(screen.queryByText('level-2-arch.png')).not.toBeInTheDocument());
    expect(calls.find((c) => c.method === 'DELETE')!.url).toBe('/api/underlays/u-1');
  });

  it('when the role cannot edit, then the list is shown without upload, show, calibrate or delete', async () => {
    stubServer([underlay({ visible: false })]);
    renderPanel({ canEdit: false });
    expect(await screen.findByText('level-2-arch.png')).toBeInTheDocument();
    expect(screen.getByText('Hidden.')).toBeInTheDocument();
    expect(screen.queryByLabelText('Upload a plan (image or PDF)')).not.toBeInTheDocument();
    expect(screen.queryByRole('checkbox', { name: 'Show' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Calibrate' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Delete…' })).not.toBeInTheDocument();
  });
});

describe('UnderlayPanel: PDF underlays', () => {
  const pdf = (over: Partial<Underlay> = {}) =>
    underlay({ id: 'u-pdf', filename: 'A-201.pdf', mime: 'application/pdf', width_px: 2592, height_px: 1728, page: 2, pageCount: 3, ...over });

  it('when a PDF underlay is listed, then its page, page count and size in points show, and the page is drawn', async () => {
    stubServer([pdf()]);
    renderPanel();
    expect(await screen.findByText(/PDF page 2 of 3 · 2592 × 1728 pt/)).toBeInTheDocument();
    expect(screen.getByText(/1 pt = 0\.0500 ft/)).toBeInTheDocument();
    expect(await screen.findByTestId('pdf-page-ready')).toHaveTextContent('Page 2 drawn.');
    expect(pdfPages.calls).toContainEqual(['/api/underlays/u-1/image', 2]);
  });

  it('when another page is picked, then page: 3 is sent; when Lock is ticked, then locked: true is sent', async () => {
    const calls = stubServer([pdf()]);
    renderPanel();
    await userEvent.selectOptions(await screen.findByRole('combobox', { name: 'Page' }), '3');
    await waitFor(() => expect(calls.filter((c) => c.method === 'PATCH')).toHaveLength(1));
    expect(JSON.parse(String(calls.find((c) => c.method === 'PATCH')!.body))).toEqual({ page: 3 });
    await userEvent.click(screen.getByRole('checkbox', { name: 'Lock' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'PATCH')).toHaveLength(2));
    expect(JSON.parse(String(calls.filter((c) => c.method === 'PATCH')[1].body))).toEqual({ locked: true });
  });

  it('when Lock is ticked while the server is still answering, then the box is ticked and Calibrate disabled at once; a refusal unticks it again', async () => {
    let answer: ((r: Response) => void) | null = null;
    vi.stubGlobal(
      'fetch',
      vi.fn(async (_url: string, init?: RequestInit) => {
        if ((init?.method ?? 'GET') === 'GET') return jsonResponse(200, { underlays: [pdf()] });
        return new Promise<Response>((resolve) => (answer = resolve));
      }),
    );
    renderPanel();
    const lock = await screen.findByRole('checkbox', { name: 'Lock' });
    expect(lock).not.toBeChecked();
    fireEvent.click(lock); // a click, and nothing awaited after it (the query cache updates a moment later)
    expect(lock).toBeChecked(); // in the same event, before any answer from the server
    expect(screen.getByRole('button', { name: 'Calibrate' })).toBeDisabled();
    expect(screen.getByRole('combobox', { name: 'Page' })).toBeDisabled();
    await waitFor(() => expect(answer).not.toBeNull()); // the PATCH is on its way
    await act(async () => answer!(jsonResponse(403, { error: { code: 'forbidden', message: 'Only an engineer or the owner may change underlays.' } })));
    expect(await screen.findByText('Only an engineer or the owner may change underlays.')).toBeVisible();
    await waitFor(() => expect(screen.getByRole('checkbox', { name: 'Lock' })).not.toBeChecked());
    expect(screen.getByRole('button', { name: 'Calibrate' })).toBeEnabled();
  });

  it('when the underlay is locked, then Calibrate, Pick on the plan and the page picker are disabled', async () => {
    stubServer([pdf({ locked: true })]);
    renderPanel({ onPickCalibration: () => undefined });
    expect(await screen.findByRole('button', { name: 'Calibrate' })).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Pick on the plan' })).toBeDisabled();
    expect(screen.getByRole('combobox', { name: 'Page' })).toBeDisabled();
    expect(screen.getByRole('checkbox', { name: 'Lock' })).toBeChecked();
  });

  it('when a PDF underlay is drawn on the plan, then its rendered page is the Konva image, sized by its points and the scale', async () => {
    const sources: string[] = [];
    const loaded: { onload: (() => void) | null }[] = [];
    class FakeImage {
      onload: (() => void) | null = null;
      onerror: (() => void) | null = null;
      set src(v: string) {
        sources.push(v);
        loaded.push(this);
      }
    }
    vi.stubGlobal('Image', FakeImage);
    const stage = createRef<Konva.Stage>();
    render(
      <Stage ref={stage} width={800} height={600}>
        <Layer>
          <UnderlayImage underlay={pdf({ id: 'u-pdf', placement: { origin_ft: [0, 86.4], scale_ft_per_px: 0.05, rotation_deg: 0 } })} view={{ scale: 2, x: 0, y: 400 }} />
        </Layer>
      </Stage>,
    );
    await waitFor(() => expect(sources).toEqual(['blob:rendered-page-2']));
    act(() => loaded[0].onload!());
    // 2592 pt × 0.05 ft/pt × 2 px/ft = 259.2 px wide; top at −86.4 × 2 + 400 = 227.2 px.
    const node = stage.current!.findOne('.underlay-u-pdf')!;
    expect(node.getAttrs().width).toBeCloseTo(259.2, 9);
    expect(node.getAttrs().height).toBeCloseTo(172.8, 9);
    expect(node.getAttrs().y).toBeCloseTo(227.2, 9);
  });
});

describe('UnderlayImage (react-konva)', () => {
  it('when the image has loaded, then a Konva image is placed by the view and the placement, at its opacity', async () => {
    const loaded: { onload: (() => void) | null }[] = [];
    class FakeImage {
      onload: (() => void) | null = null;
      onerror: (() => void) | null = null;
      width = 2400;
      height = 1600;
      set src(_v: string) {
        loaded.push(this);
      }
    }
    vi.stubGlobal('Image', FakeImage);
    const stage = createRef<Konva.Stage>();
    const view = { scale: 4, x: 20, y: 500 };
    render(
      <Stage ref={stage} width={800} height={600}>
        <Layer>
          <UnderlayImage underlay={underlay({ opacity: 0.35 })} view={view} />
        </Layer>
      </Stage>,
    );
    expect(stage.current!.findOne('.underlay-u-1')).toBeUndefined(); // nothing while loading
    act(() => loaded[0].onload!());
    const node = stage.current!.findOne('.underlay-u-1')!;
    // Top-left (0, 80) ft → (0·4 + 20, −80·4 + 500) px; 2400 px × 0.05 ft × 4 px/ft = 480 px wide.
    expect(node.getAttrs()).toMatchObject({ x: 20, y: 180, width: 480, height: 320, rotation: 0, opacity: 0.35, listening: false });
  });

  it('when the underlay is hidden, then nothing is drawn and the image is not fetched', () => {
    const created: unknown[] = [];
    vi.stubGlobal('Image', class { constructor() { created.push(this); } });
    const stage = createRef<Konva.Stage>();
    render(
      <Stage ref={stage} width={100} height={100}>
        <Layer>
          <UnderlayImage underlay={underlay({ visible: false })} view={{ scale: 1, x: 0, y: 0 }} />
        </Layer>
      </Stage>,
    );
    expect(stage.current!.findOne('.underlay-u-1')).toBeUndefined();
    expect(created).toEqual([]);
  });
});
