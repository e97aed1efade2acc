// plotly.js-dist-min ships no types; it is the same API as plotly.js (typed by @types/plotly.js).
declare module 'plotly.js-dist-min' {
  import Plotly from 'plotly.js';
  export default Plotly;
}
