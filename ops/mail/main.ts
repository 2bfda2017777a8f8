import { startMailServer } from './server.js';

/** The local mail server as its own process (started by npm start). */
const databaseUrl = process.env.DATABASE_URL;
if (!databaseUrl) throw new Error('DATABASE_URL is required for the local mail server');
const mail = await startMailServer({ port: Number(process.env.SMTP_PORT ?? 4625), databaseUrl });
console.log(`local mail server listening on 127.0.0.1:${mail.port}`);

const stop = () => void mail.close().then(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
