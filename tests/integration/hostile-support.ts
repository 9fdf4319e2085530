/** A loopback SMTP server for tests that send mail: accepts everything, remembers recipients. */
import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";

export interface SmtpSink {
  port: number;
  recipients: string[];
  close(): Promise<void>;
}

export async function startSmtpSink(port = 0): Promise<SmtpSink> {
  const recipients: string[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onRcptTo(address, _session, cb) {
      recipients.push(address.address);
      cb();
    },
    onData(stream, _session, cb) {
      stream.resume();
      stream.on("end", () => cb());
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  return {
    port: (server.server.address() as AddressInfo).port,
    recipients,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
