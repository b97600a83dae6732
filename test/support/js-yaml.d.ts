// The one function of js-yaml the tests use (the package ships no types). js-yaml is
// installed with electron-builder, which reads its YAML configuration with it.
declare module 'js-yaml' {
  export function load(text: string): unknown;
}
