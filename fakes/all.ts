// Starts every hosted-service stand-in with the env defaults, for `npm run fakes` and local start-up.
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { githubOAuthFakeOptionsFromEnv, startGithubOAuthFake } from './github-oauth';
import { s3FakeOptionsFromEnv, startS3Fake } from './s3';
import { smtpFakeOptionsFromEnv, startSmtpFake } from './smtp';

type Stoppable = { stop(): Promise<void> };

/** Starts the S3, SMTP and GitHub OAuth fakes; if one fails, the ones already up are stopped. */
export async function startAllFakes(env: NodeJS.ProcessEnv = process.env): Promise<{ lines: string[]; stop(): Promise<void> }> {
  const started: Stoppable[] = [];
  const stop = async () => {
    await Promise.allSettled(started.map((fake) => fake.stop()));
  };
  try {
    const s3Options = s3FakeOptionsFromEnv(env);
    const s3 = await startS3Fake(s3Options);
    started.push(s3);
    const smtp = await startSmtpFake(smtpFakeOptionsFromEnv(env));
    started.push(smtp);
    const github = await startGithubOAuthFake(githubOAuthFakeOptionsFromEnv(env));
    started.push(github);
    return {
      lines: [
        `s3 fake:           ${s3.url} (buckets: ${s3Options.buckets.join(', ')})`,
        `smtp fake:         smtp://127.0.0.1:${smtp.smtpPort} (inbox ${smtp.httpUrl})`,
        `github oauth fake: ${github.url}`,
      ],
      stop,
    };
  } catch (err) {
    await stop();
    throw err;
  }
}

const isMain = process.argv[1] !== undefined && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href;
if (isMain) {
  const fakes = await startAllFakes().catch((err: unknown) => {
    console.error('Could not start the fakes:', err instanceof Error ? err.message : err);
    process.exit(1);
  });
  for (const line of fakes.lines) console.log(line);
  let stopping = false;
  const shutdown = () => {
    if (stopping) return;
    stopping = true;
    void fakes.stop().then(() => process.exit(0));
  };
  process.once('SIGINT', shutdown);
  process.once('SIGTERM', shutdown);
}
