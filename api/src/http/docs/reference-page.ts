/**
 * The browsable API reference: a page and a start-up script, both static text. The page loads
 * only files this server serves (swagger-ui-dist's, from node_modules) and holds no inline
 * script, so the app's CSP (`script-src 'self'`) holds for it unchanged.
 */

export const DOCS_BASE = '/api/docs';

/** The files of swagger-ui-dist the page needs; nothing else of the package is served. */
export const SWAGGER_UI_ASSETS: ReadonlySet<string> = new Set(['swagger-ui.css', 'swagger-ui-bundle.js', 'favicon-32x32.png', 'favicon-16x16.png']);

export const REFERENCE_PAGE = `<!DOCTYPE html>
<html lang="en">
<head>
  <meta charset="utf-8">
  <meta name="viewport" content="width=device-width, initial-scale=1">
  <title>Seamline API reference</title>
  <link rel="stylesheet" href="${DOCS_BASE}/swagger-ui.css">
  <link rel="icon" type="image/png" href="${DOCS_BASE}/favicon-32x32.png" sizes="32x32">
  <link rel="icon" type="image/png" href="${DOCS_BASE}/favicon-16x16.png" sizes="16x16">
</head>
<body>
  <noscript>The API reference needs JavaScript. The document itself is at <a href="${DOCS_BASE}/openapi.json">${DOCS_BASE}/openapi.json</a>.</noscript>
  <div id="swagger-ui"></div>
  <script src="${DOCS_BASE}/swagger-ui-bundle.js"></script>
  <script src="${DOCS_BASE}/initializer.js"></script>
</body>
</html>
`;

/**
 * Starts the viewer on our document. No validator (it would call out to another site), roles
 * shown (they live in x- extensions), and "Try it out" changes carry the anti-forgery header
 * the app's session needs, read from the XSRF-TOKEN cookie as the web app does.
 */
export const REFERENCE_INITIALIZER = `'use strict';
(function () {
  function xsrfToken() {
    var match = document.cookie.match(/(?:^|;\\s*)XSRF-TOKEN=([^;]*)/);
    return match ? decodeURIComponent(match[1]) : null;
  }
  window.ui = SwaggerUIBundle({
    url: '${DOCS_BASE}/openapi.json',
    dom_id: '#swagger-ui',
    deepLinking: true,
    validatorUrl: null,
    showExtensions: true,
    docExpansion: 'list',
    presets: [SwaggerUIBundle.presets.apis],
    layout: 'BaseLayout',
    requestInterceptor: function (request) {
      var token = xsrfToken();
      if (token && !/^(GET|HEAD|OPTIONS)$/i.test(request.method || 'GET')) request.headers['X-XSRF-TOKEN'] = token;
      return request;
    },
  });
})();
`;
