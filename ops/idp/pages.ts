/** The local identity provider's own pages, in Shadowloop's look. */

const escape = (value: string): string =>
  value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

const STYLE = `
@font-face { font-family: 'Roboto Condensed'; font-weight: 400; src: url('/fonts/roboto-condensed-latin-400-normal.woff2') format('woff2'); }
@font-face { font-family: 'Roboto Condensed'; font-weight: 700; src: url('/fonts/roboto-condensed-latin-700-normal.woff2') format('woff2'); }
body { margin: 0; background: #F4F5F0; color: #172026; font-family: 'Roboto Condensed', sans-serif; }
main { max-width: 26rem; margin: 8vh auto; background: #FFFFFF; border: 1px solid #D5D9D2; padding: 1.5rem 2rem; }
h1 { font-size: 1.35rem; margin: 0 0 .25rem; } .stand-in { font-size: .85rem; color: #667085; margin: 0 0 1.25rem; }
label { display: block; font-weight: 700; margin: .75rem 0 .25rem; }
input { width: 100%; box-sizing: border-box; padding: .45rem .5rem; border: 1px solid #D5D9D2; font: inherit; }
button { margin-top: 1.25rem; padding: .5rem 1rem; background: #172026; color: #FFFFFF; border: 0; font: inherit; font-weight: 700; cursor: pointer; }
button.secondary { background: #FFFFFF; color: #172026; border: 1px solid #D5D9D2; margin-left: .5rem; }
.error { color: #B42318; font-weight: 700; } ul { padding-left: 1.2rem; }`;

function layout(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>${escape(title)} · Shadowloop identity stand-in</title><style>${STYLE}</style></head>
<body><main><h1>${escape(title)}</h1>
<p class="stand-in">Local identity provider for development and tests. A site installation signs in against the plant's own identity provider instead.</p>
${body}</main></body></html>`;
}

export function loginPage(uid: string, options: { email?: string; error?: string } = {}): string {
  const error = options.error ? `<p class="error" role="alert">${escape(options.error)}</p>` : '';
  return layout(
    'Sign in to Shadowloop',
    `${error}<form method="post" action="/interaction/${escape(uid)}/login" autocomplete="off">
<label for="email">E-mail</label><input id="email" name="email" type="email" required value="${escape(options.email ?? '')}">
<label for="password">Password</label><input id="password" name="password" type="password" required>
<button type="submit">Sign in</button></form>`,
  );
}

export function consentPage(uid: string, clientName: string, scopes: string[]): string {
  const items = scopes.map((scope) => `<li>${escape(scope)}</li>`).join('');
  return layout(
    'Allow access',
    `<p><strong>${escape(clientName)}</strong> asks to use your identity:</p><ul>${items}</ul>
<form method="post" action="/interaction/${escape(uid)}/confirm" style="display:inline"><button type="submit">Allow</button></form>
<form method="post" action="/interaction/${escape(uid)}/abort" style="display:inline"><button class="secondary" type="submit">Cancel</button></form>`,
  );
}
