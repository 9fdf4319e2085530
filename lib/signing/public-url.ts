import { appUrl } from "@/lib/mail/transport";

/** The public page of one statement, printed in the PDF: APP_URL/verify/REF. */
export const verifyUrl = (statementId: string) => `${appUrl()}/verify/${statementId}`;
