import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Patch, Post, Put, Query, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { CurrentMembership } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { Membership } from '../guilds/membership.entity';
import { DuesLedgerService } from './dues-ledger.service';
import { DuesReportService } from './dues-report.service';
import { DuesService } from './dues.service';
import {
  CheckoutDto,
  CreateHouseholdDto,
  CreatePlanDto,
  DuesSettingsDto,
  LedgerQueryDto,
  ListQueryDto,
  ManualPaymentDto,
  RefundDto,
  RosterQueryDto,
  UpdateDuesMemberDto,
  UpdatePlanDto,
} from './dto/dues.dto';

const id = () => new ParseIntPipe({ errorHttpStatusCode: 404 });
const statusList = (status?: string) => (status ? status.split(',') : []);

function sendCsv(res: Response, filename: string, csv: string): void {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${filename.replace(/[^A-Za-z0-9._-]/g, '-')}"`);
  res.setHeader('Cache-Control', 'private, no-store');
  res.send(csv);
}

/** Dues for members (their own) and the treasurer (everyone's). Admins hold the treasurer's rights. */
@ApiTags('dues')
@Controller('guilds/:guildId/dues')
export class DuesController {
  constructor(
    private readonly dues: DuesService,
    private readonly books: DuesLedgerService,
    private readonly reports: DuesReportService,
  ) {}

  /** The year-end report: money in by month and plan, fees, refunds, net; members by status. */
  @Roles('treasurer')
  @Get('report')
  report(@CurrentMembership() me: Membership, @Query('year') year?: string) {
    return this.reports.report(me, year);
  }

  @Roles('treasurer')
  @Get('report.csv')
  async reportCsv(@CurrentMembership() me: Membership, @Res() res: Response, @Query('year') year?: string) {
    const { filename, csv } = await this.reports.reportCsv(me, year);
    sendCsv(res, filename, csv);
  }

  @Roles('treasurer')
  @Get('report.pdf')
  async reportPdf(@CurrentMembership() me: Membership, @Res() res: Response, @Query('year') year?: string) {
    const { filename, pdf } = await this.reports.reportPdf(me, year);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `inline; filename="${filename}"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(pdf);
  }

  @Get('settings')
  settings(@CurrentMembership() me: Membership) {
    return this.dues.getSettings(me);
  }

  @Roles('treasurer')
  @Put('settings')
  putSettings(@CurrentMembership() me: Membership, @Body() body: DuesSettingsDto) {
    return this.dues.putSettings(me, body);
  }

  @Get('plans')
  plans(@CurrentMembership() me: Membership) {
    return this.dues.listPlans(me);
  }

  @Roles('treasurer')
  @Post('plans')
  createPlan(@CurrentMembership() me: Membership, @Body() body: CreatePlanDto) {
    return this.dues.createPlan(me, body);
  }

  @Roles('treasurer')
  @Patch('plans/:planId')
  updatePlan(@CurrentMembership() me: Membership, @Param('planId', id()) planId: number, @Body() body: UpdatePlanDto) {
    return this.dues.updatePlan(me, planId, body);
  }

  @Get('me')
  mine(@CurrentMembership() me: Membership) {
    return this.dues.me(me);
  }

  @Post('checkout')
  checkout(@CurrentMembership() me: Membership, @Body() body: CheckoutDto) {
    return this.books.checkout(me, body.planId);
  }

  @Roles('treasurer')
  @Get('ledger')
  ledger(@CurrentMembership() me: Membership, @Query() query: LedgerQueryDto) {
    return this.books.ledger(me, query);
  }

  @Roles('treasurer')
  @Get('ledger.csv')
  async ledgerCsv(@CurrentMembership() me: Membership, @Query() query: LedgerQueryDto, @Res() res: Response) {
    sendCsv(res, `ledger${query.year ? `-${query.year}` : ''}.csv`, await this.books.ledgerCsv(me, query));
  }

  /** Her own invoice, or any for the treasurer (404 otherwise); checked with the payment service while open. */
  @Get('invoices/:invoiceId')
  invoice(@CurrentMembership() me: Membership, @Param('invoiceId', id()) invoiceId: number) {
    return this.books.invoice(me, invoiceId);
  }

  @Get('invoices/:invoiceId/receipt.pdf')
  async receipt(@CurrentMembership() me: Membership, @Param('invoiceId', id()) invoiceId: number, @Res() res: Response) {
    const { filename, pdf } = await this.books.receiptPdf(me, invoiceId);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `inline; filename="${filename}"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(pdf);
  }

  @Roles('treasurer')
  @Post('payments')
  recordPayment(@CurrentMembership() me: Membership, @Body() body: ManualPaymentDto) {
    return this.books.recordManual(me, body);
  }

  @Roles('treasurer')
  @Post('invoices/:invoiceId/refunds')
  refund(@CurrentMembership() me: Membership, @Param('invoiceId', id()) invoiceId: number, @Body() body: RefundDto) {
    return this.books.refund(me, invoiceId, body);
  }

  @Roles('treasurer')
  @Post('invoices/:invoiceId/void')
  @HttpCode(200)
  void(@CurrentMembership() me: Membership, @Param('invoiceId', id()) invoiceId: number) {
    return this.books.voidInvoice(me, invoiceId);
  }

  @Roles('treasurer')
  @Get('roster')
  roster(@CurrentMembership() me: Membership, @Query() query: RosterQueryDto) {
    return this.dues.roster(me, statusList(query.status));
  }

  @Roles('treasurer')
  @Get('roster.csv')
  async rosterCsv(@CurrentMembership() me: Membership, @Query() query: RosterQueryDto, @Res() res: Response) {
    sendCsv(res, 'dues-roster.csv', await this.dues.rosterCsv(me, statusList(query.status)));
  }

  @Roles('treasurer')
  @Patch('members/:membershipId')
  updateMember(@CurrentMembership() me: Membership, @Param('membershipId', id()) membershipId: number, @Body() body: UpdateDuesMemberDto) {
    return this.dues.updateMember(me, membershipId, body);
  }

  @Roles('treasurer')
  @Get('households')
  households(@CurrentMembership() me: Membership) {
    return this.dues.households(me);
  }

  @Roles('treasurer')
  @Post('households')
  createHousehold(@CurrentMembership() me: Membership, @Body() body: CreateHouseholdDto) {
    return this.dues.createHousehold(me, body);
  }

  @Roles('treasurer')
  @Get('audit')
  audit(@CurrentMembership() me: Membership, @Query() query: ListQueryDto) {
    return this.dues.audit(me, query.limit ?? 100);
  }
}
