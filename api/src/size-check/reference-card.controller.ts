import { BadRequestException, Controller, Get, Query, StreamableFile } from '@nestjs/common';
import { ApiProduces, ApiQuery, ApiTags } from '@nestjs/swagger';
import { PAPERS, Paper, renderReferenceCard } from './reference-card';

/** Parses `?paper=`: letter when absent, otherwise exactly "letter" or "a4". */
export function parsePaper(value: unknown): Paper {
  if (value === undefined) return 'letter';
  if (typeof value === 'string' && (PAPERS as readonly string[]).includes(value)) return value as Paper;
  throw new BadRequestException('Choose paper=letter or paper=a4.');
}

/** The printable reference card. Signed-in members only (the global guard sees to that). */
@ApiTags('size-check')
@Controller('size-check')
export class ReferenceCardController {
  /** The card never changes while the process runs, so each paper size is rendered once. */
  private readonly rendered = new Map<Paper, Promise<Buffer>>();

  @Get('card.pdf')
  @ApiProduces('application/pdf')
  @ApiQuery({ name: 'paper', required: false, enum: PAPERS })
  async card(@Query('paper') paperParam?: string): Promise<StreamableFile> {
    const paper = parsePaper(paperParam);
    let pdf = this.rendered.get(paper);
    if (!pdf) {
      pdf = renderReferenceCard(paper);
      this.rendered.set(paper, pdf);
      // A failed render is not remembered; the next request tries again.
      pdf.catch(() => this.rendered.delete(paper));
    }
    const bytes = await pdf;
    return new StreamableFile(bytes, {
      type: 'application/pdf',
      disposition: `inline; filename="selvage-reference-card-${paper}.pdf"`,
      length: bytes.length,
    });
  }
}
