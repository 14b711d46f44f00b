/** The fake provider's pages, in Decant's colours and font so the demo reads as one product. */
const escapeHtml = (value: string) =>
  value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const styles = `
  @font-face { font-family: 'Noto Sans'; font-weight: 400; src: url('/assets/noto-sans-400.woff2') format('woff2'); }
  @font-face { font-family: 'Noto Sans'; font-weight: 600; src: url('/assets/noto-sans-600.woff2') format('woff2'); }
  :root { color-scheme: light; }
  body { margin: 0; min-height: 100vh; display: grid; place-items: center; background: #f6f3ec;
         font-family: 'Noto Sans', sans-serif; color: #1c2b33; }
  main { width: min(380px, calc(100vw - 32px)); background: #fffdf8; border: 1px solid #d9d3c4;
         border-top: 6px solid #0e5e6f; border-radius: 10px; padding: 28px 28px 24px; box-shadow: 0 6px 24px #1c2b3314; }
  h1 { font-size: 1.25rem; margin: 0 0 4px; font-weight: 600; }
  p.lead { margin: 0 0 20px; color: #4a5a62; font-size: .9rem; }
  label { display: block; font-size: .85rem; font-weight: 600; margin: 14px 0 6px; }
  input { box-sizing: border-box; width: 100%; padding: 10px 12px; font: inherit; border: 1px solid #9fb0b5;
          border-radius: 6px; background: #fff; }
  input:focus { outline: 3px solid #e0a23b66; border-color: #0e5e6f; }
  button { margin-top: 22px; width: 100%; padding: 11px; font: inherit; font-weight: 600; color: #fff;
           background: #0e5e6f; border: 0; border-radius: 6px; cursor: pointer; }
  button:hover { background: #0b4d5b; }
  .error { margin: 0 0 12px; padding: 10px 12px; border-radius: 6px; background: #fbeae5; color: #8a2a12;
           border-left: 4px solid #b4441f; font-size: .9rem; }
  .mark { display: inline-block; width: 10px; height: 10px; border-radius: 50%; background: #e0a23b; margin-right: 8px; }
  footer { margin-top: 18px; font-size: .75rem; color: #6b777c; }`;

function layout(title: string, body: string, script = ''): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1"><title>${escapeHtml(title)}</title>
<style>${styles}</style></head><body><main>${body}</main>${script}</body></html>`;
}

export function loginPage(options: { uid: string; email?: string; error?: string }): string {
  const error = options.error ? `<p class="error" role="alert">${escapeHtml(options.error)}</p>` : '';
  return layout(
    'Sign in — Decant test identity provider',
    `<h1><span class="mark" aria-hidden="true"></span>Sign in to Decant</h1>
     <p class="lead">Test identity provider for local use</p>
     ${error}
     <form method="post" action="/interaction/${escapeHtml(options.uid)}/login" autocomplete="off">
       <label for="email">E-mail</label>
       <input id="email" name="email" type="email" autocomplete="username" required autofocus value="${escapeHtml(options.email ?? '')}">
       <label for="password">Password</label>
       <input id="password" name="password" type="password" autocomplete="current-password" required>
       <button type="submit">Sign in</button>
     </form>
     <footer>Accounts here are demo accounts. A real deployment signs in through the organisation's own provider.</footer>`,
  );
}

/** oidc-provider hands us a form with its own anti-forgery field; we submit it at once. */
export function logoutPage(form: string): string {
  return layout(
    'Signing out — Decant test identity provider',
    `<h1>Signing out…</h1>${form}<noscript><button form="op.logoutForm" name="logout" value="yes">Sign out</button></noscript>`,
    `<script>const f=document.getElementById('op.logoutForm');const i=document.createElement('input');
i.type='hidden';i.name='logout';i.value='yes';f.appendChild(i);f.submit();</script>`,
  );
}

export function signedOutPage(): string {
  return layout('Signed out', '<h1>Signed out</h1><p class="lead">You can close this window.</p>');
}
