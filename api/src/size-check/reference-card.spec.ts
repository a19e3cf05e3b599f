import { spawnSync } from 'node:child_process';
import { BadRequestException } from '@nestjs/common';
import { Jimp } from 'jimp';
import { CARD } from './card-geometry';
import { loadOpenCv } from './measure/opencv';
import { FOOTER, PAGE_SIZE_PT, Paper, cardOriginPt, mm, renderReferenceCard } from './reference-card';
import { ReferenceCardController, parsePaper } from './reference-card.controller';

const PAPERS: Paper[] = ['letter', 'a4'];

/** The PDF's objects by number, as latin1 text (uncompressed renders only for streams). */
function objects(pdf: string): Map<number, string> {
  const map = new Map<number, string>();
  for (const m of pdf.matchAll(/(\d+) 0 obj\b([\s\S]*?)\bendobj/g)) map.set(Number(m[1]), m[2]);
  return map;
}

function streamOf(obj: string): string {
  const m = /stream\r?\n([\s\S]*?)\r?\nendstream/.exec(obj);
  if (!m) throw new Error('no stream');
  return m[1];
}

/** glyph code -> text, from a ToUnicode CMap as pdfkit writes it (bfrange with arrays, and bfchar). */
function parseCmap(cmap: string): Map<number, string> {
  const map = new Map<number, string>();
  const hexToText = (hex: string) => {
    const units = hex.replace(/\s+/g, '').match(/.{4}/g) ?? [];
    return String.fromCharCode(...units.map((u) => parseInt(u, 16)));
  };
  for (const section of cmap.matchAll(/beginbfrange([\s\S]*?)endbfrange/g)) {
    for (const m of section[1].matchAll(/<([0-9a-f]+)>\s*<([0-9a-f]+)>\s*(\[[^\]]*\]|<[0-9a-f\s]+>)/gi)) {
      const start = parseInt(m[1], 16);
      const end = parseInt(m[2], 16);
      if (m[3].startsWith('[')) {
        [...m[3].matchAll(/<([0-9a-f\s]+)>/gi)].forEach((e, i) => map.set(start + i, hexToText(e[1])));
      } else {
        const first = hexToText(m[3].slice(1, -1));
        for (let c = start; c <= end; c++) map.set(c, String.fromCharCode(first.charCodeAt(0) + (c - start)));
      }
    }
  }
  for (const section of cmap.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
    for (const m of section[1].matchAll(/<([0-9a-f]+)>\s*<([0-9a-f\s]+)>/gi)) map.set(parseInt(m[1], 16), hexToText(m[2]));
  }
  return map;
}

/** The page's text, decoded through each font's ToUnicode map, text objects joined by spaces. */
function pageText(pdfBytes: Buffer): string {
  const pdf = pdfBytes.toString('latin1');
  const objs = objects(pdf);
  const page = [...objs.values()].find((o) => /\/Type \/Page(?!s)/.test(o))!;
  const resourcesRef = /\/Resources (\d+) 0 R/.exec(page);
  const resources = resourcesRef ? objs.get(Number(resourcesRef[1]))! : page;
  const fontDict = /\/Font <<([\s\S]*?)>>/.exec(resources)![1];
  const cmaps = new Map<string, Map<number, string>>();
  for (const m of fontDict.matchAll(/\/(\w+) (\d+) 0 R/g)) {
    const font = objs.get(Number(m[2]))!;
    const toUnicode = /\/ToUnicode (\d+) 0 R/.exec(font);
    if (toUnicode) cmaps.set(m[1], parseCmap(streamOf(objs.get(Number(toUnicode[1]))!)));
  }
  const contentRef = /\/Contents (\d+) 0 R/.exec(page)![1];
  const content = streamOf(objs.get(Number(contentRef))!);
  const pieces: string[] = [];
  let cmap: Map<number, string> | undefined;
  for (const m of content.matchAll(/\/(\w+) [\d.]+ Tf|\[((?:<[0-9a-f]*>|[^\]])*)\] TJ|<([0-9a-f]*)> Tj|\bET\b/gi)) {
    if (m[1]) cmap = cmaps.get(m[1]);
    else if (m[0] === 'ET') pieces.push(' ');
    else {
      const hex = m[2] !== undefined ? [...m[2].matchAll(/<([0-9a-f]*)>/gi)].map((h) => h[1]).join('') : m[3];
      for (const code of hex.match(/.{4}/g) ?? []) pieces.push(cmap?.get(parseInt(code, 16)) ?? '\uFFFD');
    }
  }
  return pieces.join('').replace(/\s+/g, ' ');
}

describe('renderReferenceCard', () => {
  const compressed = new Map<Paper, Buffer>();
  const plain = new Map<Paper, Buffer>();

  beforeAll(async () => {
    for (const paper of PAPERS) {
      compressed.set(paper, await renderReferenceCard(paper));
      plain.set(paper, await renderReferenceCard(paper, { compress: false }));
    }
  });

  describe.each(PAPERS)('on %s paper', (paper) => {
    it('is a one-page PDF of the right size', () => {
      for (const pdf of [compressed.get(paper)!, plain.get(paper)!]) {
        const text = pdf.toString('latin1');
        expect(text.startsWith('%PDF-')).toBe(true);
        expect(text.match(/\/Type \/Page\b/g)).toHaveLength(1);
        expect(text).toMatch(/\/Type \/Pages[\s\S]*?\/Count 1\b/);
        const boxes = [...text.matchAll(/\/MediaBox \[([^\]]*)\]/g)].map((m) => m[1].trim().split(/\s+/).map(Number));
        expect(boxes).toEqual([[0, 0, ...PAGE_SIZE_PT[paper]]]);
      }
    });

    it('embeds the Atkinson Hyperlegible fonts and carries its metadata', () => {
      const text = compressed.get(paper)!.toString('latin1');
      expect(text).toMatch(/\/FontFile2 \d+ 0 R/);
      expect(text).toMatch(/\/BaseFont \/[A-Z]{6}\+AtkinsonHyperlegibleNext-Regular/);
      expect(text).toMatch(/\/BaseFont \/[A-Z]{6}\+AtkinsonHyperlegibleNext-Bold/);
      const objs = objects(text);
      const info = (key: string) => {
        const direct = new RegExp(`/${key} (\\([^)]*\\)|(\\d+) 0 R)`).exec(text)!;
        return (direct[2] ? objs.get(Number(direct[2]))! : direct[1]).trim();
      };
      expect(info('Title')).toBe('(Selvage reference card)');
      expect(info('Author')).toBe('(Selvage)');
      expect(text).toMatch(/\/PrintScaling \/None/);
    });

    it('says how to print, check, photograph and stay safe', () => {
      const text = pageText(plain.get(paper)!);
      for (const phrase of [
        'Print this page at 100% (actual size).',
        'Turn off “fit to page” or “shrink to fit”.',
        'Check your print: measure the long bar with your own ruler and type what it reads when you upload a photo.',
        'contrasts with it',
        'on the same surface',
        'the whole block and the whole card in the picture',
        'camera straight above',
        'no shadow across the block',
        'Close the rotary cutter guard after every cut.',
        'Unplug the iron when you finish.',
        'Cut along the dashed line if you like.',
        FOOTER,
        '1 inch',
        CARD.inchBar.label,
        CARD.cmBar.label,
      ]) {
        expect(text).toContain(phrase);
      }
      expect(text).not.toContain('\uFFFD');
    });
  });

  // The real check: print-like rasterisation, then the same detector the photos go through.
  const havePdftoppm = spawnSync('which', ['pdftoppm']).status === 0;
  const rasterIt = havePdftoppm ? it : it.skip;
  const skipNote = havePdftoppm ? '' : ' [SKIPPED: pdftoppm not installed; apt-get install poppler-utils to run it]';

  describe.each(PAPERS)('rasterised at 150 dpi on %s paper', (paper) => {
    rasterIt(`shows markers 0–3 where the card geometry puts them${skipNote}`, async () => {
      const dpi = 150;
      const png = spawnSync('pdftoppm', ['-r', String(dpi), '-png', '-singlefile', '-'], {
        input: compressed.get(paper)!,
        maxBuffer: 64 * 1024 * 1024,
      });
      expect(png.status).toBe(0);
      const { data, width, height } = (await Jimp.read(png.stdout)).bitmap;
      const [pageW, pageH] = PAGE_SIZE_PT[paper];
      expect([width, height]).toEqual([Math.ceil((pageW * dpi) / 72), Math.ceil((pageH * dpi) / 72)]);

      const cv = (await loadOpenCv()) as any; // the ArUco parts are missing from opencv-js's typings
      const owned: { delete(): void }[] = [];
      const own = <T extends { delete(): void }>(x: T): T => (owned.push(x), x);
      try {
        const rgba = own(cv.matFromImageData({ data, width, height }));
        const gray = own(new cv.Mat());
        cv.cvtColor(rgba, gray, cv.COLOR_RGBA2GRAY);
        const params = own(new cv.aruco_DetectorParameters());
        params.cornerRefinementMethod = cv.CORNER_REFINE_SUBPIX;
        const detector = own(
          new cv.aruco_ArucoDetector(
            own(cv.getPredefinedDictionary(cv.DICT_4X4_50)),
            params,
            own(new cv.aruco_RefineParameters(10, 3, true)),
          ),
        );
        const corners = own(new cv.MatVector());
        const ids = own(new cv.Mat());
        detector.detectMarkers(gray, corners, ids, own(new cv.MatVector()));

        const topLeft = new Map<number, [number, number]>();
        for (let i = 0; i < ids.rows; i++) {
          const c = own(corners.get(i));
          topLeft.set(ids.data32S[i], [c.data32F[0], c.data32F[1]]);
        }
        expect([...topLeft.keys()].sort()).toEqual([0, 1, 2, 3]);

        const px = (pt: number) => (pt * dpi) / 72;
        const m0 = topLeft.get(0)!;
        const m1 = topLeft.get(1)!;
        const x0 = CARD.markers.find((m) => m.id === 0)!.x;
        const x1 = CARD.markers.find((m) => m.id === 1)!.x;
        expect(x1 - x0).toBe(146);
        const expected = px(mm(x1 - x0)); // (152 − 6) mm at 150 dpi ≈ 862.2 px
        expect(Math.abs(Math.hypot(m1[0] - m0[0], m1[1] - m0[1]) - expected)).toBeLessThanOrEqual(1.5);

        // And every marker sits where the layout puts the card on the page (pixel centres at +0.5).
        const { left, top } = cardOriginPt(paper);
        for (const m of CARD.markers) {
          const [x, y] = topLeft.get(m.id)!;
          expect(Math.abs(x - (px(left + mm(m.x)) - 0.5))).toBeLessThanOrEqual(1.5);
          expect(Math.abs(y - (px(top + mm(m.y)) - 0.5))).toBeLessThanOrEqual(1.5);
        }
      } finally {
        for (const x of owned.reverse()) x.delete();
      }
    });
  });
});

describe('ReferenceCardController', () => {
  it('defaults to letter and accepts a4', () => {
    expect(parsePaper(undefined)).toBe('letter');
    expect(parsePaper('letter')).toBe('letter');
    expect(parsePaper('a4')).toBe('a4');
  });

  it.each(['', 'A4', 'legal', 'tabloid', ['a4', 'letter']])('refuses paper=%p', (value) => {
    expect(() => parsePaper(value)).toThrow(new BadRequestException('Choose paper=letter or paper=a4.'));
  });

  it('serves an inline PDF named for the paper', async () => {
    const controller = new ReferenceCardController();
    for (const paper of PAPERS) {
      const file = await controller.card(paper);
      const headers = file.getHeaders();
      expect(headers.type).toBe('application/pdf');
      expect(headers.disposition).toBe(`inline; filename="selvage-reference-card-${paper}.pdf"`);
      const chunks: Buffer[] = [];
      for await (const chunk of file.getStream()) chunks.push(chunk as Buffer);
      const body = Buffer.concat(chunks);
      expect(body.subarray(0, 5).toString()).toBe('%PDF-');
      expect(body.toString('latin1')).toContain(`/MediaBox [0 0 ${PAGE_SIZE_PT[paper].join(' ')}]`);
    }
    const defaulted = await controller.card(undefined);
    expect(defaulted.getHeaders().disposition).toBe('inline; filename="selvage-reference-card-letter.pdf"');
    await expect(controller.card('legal')).rejects.toThrow('Choose paper=letter or paper=a4.');
  });
});
