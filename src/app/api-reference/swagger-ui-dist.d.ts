/** swagger-ui-dist ships no types; this feature imports two of its files through the build's loaders. */

/** The browser bundle, as the address of the file the build emits (`{ loader: 'file' }`). */
declare module 'swagger-ui-dist/swagger-ui-bundle.js' {
  const url: string;
  export default url;
}

/** The stylesheet, as text (`{ loader: 'text' }`). */
declare module 'swagger-ui-dist/swagger-ui.css' {
  const css: string;
  export default css;
}
