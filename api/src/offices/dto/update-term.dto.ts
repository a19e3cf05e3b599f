import { PartialType, PickType } from '@nestjs/swagger';
import { CreateTermDto } from './create-term.dto';

/** Changes to a term's dates or note; fields left out stay as they are (`endsOn: null` = no end date). */
export class UpdateTermDto extends PartialType(PickType(CreateTermDto, ['startsOn', 'endsOn', 'note'] as const)) {}
