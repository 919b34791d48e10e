/**
 * Swagger UI, emitted by the Angular build as one of the app's own files (no CDN) and run
 * under the app's CSP: its script is loaded from this origin when the page opens (a plain
 * script, so the app's bundles carry no CommonJS support for it), its stylesheet goes in as
 * a <style> element (styles may be inline), it fetches nothing (the document is handed in)
 * and sends no requests (no "Try it out").
 */
import swaggerUiBundleUrl from 'swagger-ui-dist/swagger-ui-bundle.js' with { loader: 'file' };
import swaggerUiCss from 'swagger-ui-dist/swagger-ui.css' with { loader: 'text' };

interface SwaggerUiOptions {
  domNode: HTMLElement;
  spec: object;
  validatorUrl: string | null;
  supportedSubmitMethods: readonly string[];
  docExpansion: 'list' | 'full' | 'none';
  defaultModelsExpandDepth: number;
  deepLinking: boolean;
}

type SwaggerUiWindow = Window & { SwaggerUIBundle?: (options: SwaggerUiOptions) => unknown };

/** Loads the bundle once; it defines `window.SwaggerUIBundle`. */
function loadBundle(document: Document): Promise<NonNullable<SwaggerUiWindow['SwaggerUIBundle']>> {
  const view = document.defaultView as SwaggerUiWindow;
  if (view.SwaggerUIBundle) return Promise.resolve(view.SwaggerUIBundle);
  return new Promise((resolve, reject) => {
    const script = document.createElement('script');
    script.src = new URL(swaggerUiBundleUrl, document.baseURI).href;
    script.onload = () => (view.SwaggerUIBundle ? resolve(view.SwaggerUIBundle) : reject(new Error('Swagger UI did not start.')));
    script.onerror = () => reject(new Error('Swagger UI could not be loaded.'));
    document.head.append(script);
  });
}

export async function renderSwaggerUi(target: HTMLElement, spec: object): Promise<() => void> {
  const document = target.ownerDocument;
  const swaggerUi = await loadBundle(document);
  const style = document.createElement('style');
  style.textContent = swaggerUiCss;
  document.head.append(style);
  swaggerUi({
    domNode: target,
    spec,
    // No badge from the public validator service: nothing leaves the app's origin.
    validatorUrl: null,
    supportedSubmitMethods: [],
    docExpansion: 'list',
    defaultModelsExpandDepth: -1,
    deepLinking: false,
  });
  return () => style.remove();
}
