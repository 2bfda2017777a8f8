/** What the stack set-up hands to every integration and e2e test file. */
export interface StackInfo {
  databaseUrl: string;
  idpIssuer: string;
  smtpPort: number;
  clientId: string;
  clientSecret: string;
  /** Only in the e2e project: the api serving the built web app. */
  appUrl?: string;
  outputDir: string;
}

declare module 'vitest' {
  export interface ProvidedContext {
    stack: StackInfo;
  }
}

/** An identity-provider account with no Shadowloop user yet: signs in to test provisioning. */
export const NEWCOMER = {
  email: 'newcomer@quillmere.example',
  name: 'Noor Vance',
  roles: ['operator' as const],
};
