import { startMailSink } from "../lib/mail/sink";

/** Local SMTP sink for development and tests: every message lands as JSON in MAIL_SINK_DIR. */
const port = Number(process.env.SMTP_PORT ?? 2525);
const dir = process.env.MAIL_SINK_DIR ?? ".data/mail";
startMailSink({ port, dir })
  .then((sink) => {
    console.log(`[mail-sink] SMTP sink on 127.0.0.1:${sink.port}, messages in ${dir}`);
    const stop = () => sink.close().then(() => process.exit(0));
    process.on("SIGTERM", stop);
    process.on("SIGINT", stop);
  })
  .catch((err) => {
    console.error(`[mail-sink] could not listen on 127.0.0.1:${port}: ${err.message}. Set SMTP_PORT to a free port.`);
    process.exit(1);
  });
