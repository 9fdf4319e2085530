import { createElement, type ReactElement } from "react";
import { renderToBuffer, type DocumentProps } from "@react-pdf/renderer";
import { AnnualStatement } from "./annual-statement";
import { registerStatementFonts } from "./fonts";
import type { AnnualStatementModel, MonthlyStatementModel } from "./model";
import { MonthlyStatement } from "./monthly-statement";
import { CommunicationStatement, type CommunicationModel } from "./cbam-communication";

/** Unsigned statement PDFs; lib/signing seals them. Server-side only (reads fonts from disk). */
export async function renderMonthlyStatement(model: MonthlyStatementModel): Promise<Buffer> {
  registerStatementFonts();
  return renderToBuffer(createElement(MonthlyStatement, { model }) as unknown as ReactElement<DocumentProps>);
}

export async function renderAnnualStatement(model: AnnualStatementModel): Promise<Buffer> {
  registerStatementFonts();
  return renderToBuffer(createElement(AnnualStatement, { model }) as unknown as ReactElement<DocumentProps>);
}

export async function renderCommunication(model: CommunicationModel): Promise<Buffer> {
  registerStatementFonts();
  return renderToBuffer(createElement(CommunicationStatement, { model }) as unknown as ReactElement<DocumentProps>);
}
