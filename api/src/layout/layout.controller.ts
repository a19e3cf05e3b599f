import { BadRequestException, Body, Controller, HttpCode, Post } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { InchParseError, parseInches } from '../common/units/inches';
import { LayoutPlanDto } from './dto/layout-plan.dto';
import { arrangements, LayoutError, planLayout } from './layout-planner';
import { layoutSvg } from './layout-svg';

const inches = (v: string | null | undefined) => (v == null || v === '' ? undefined : parseInches(v));

/** The layout planner: pure arithmetic, offered to anyone signed in. */
@ApiTags('layout')
@Controller('layout-plans')
export class LayoutController {
  @Post()
  @HttpCode(200)
  plan(@Body() dto: LayoutPlanDto) {
    try {
      const options = arrangements(dto.blockCount);
      const chosen =
        dto.rows && dto.columns
          ? { rows: dto.rows, columns: dto.columns }
          : { rows: options[0].rows, columns: options[0].columns };
      if (chosen.rows * chosen.columns > dto.blockCount)
        throw new LayoutError(`${chosen.rows} rows of ${chosen.columns} need ${chosen.rows * chosen.columns} blocks; you have ${dto.blockCount}.`);
      const plan = planLayout({
        ...chosen,
        blockWidth: parseInches(dto.blockWidth),
        blockHeight: parseInches(dto.blockHeight),
        sashing: inches(dto.sashing),
        sashingAround: dto.sashingAround,
        cornerstones: dto.cornerstones,
        borders: (dto.borders ?? []).map((b) => parseInches(b)),
        bindingStripWidth: inches(dto.bindingWidth),
        usableWidth: inches(dto.fabricWidth),
        backingMargin: inches(dto.backingMargin),
        battingMargin: inches(dto.battingMargin),
      });
      return { arrangements: options, plan, leftover: dto.blockCount - plan.blockCount, svg: layoutSvg(plan) };
    } catch (e) {
      if (e instanceof LayoutError || e instanceof InchParseError) throw new BadRequestException(e.message);
      throw e;
    }
  }
}
