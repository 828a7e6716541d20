// The parts of plotly.js-dist-min that Wickwright uses (the package ships no types of its own).
declare module 'plotly.js-dist-min' {
  interface PlotlyStatic {
    react(root: HTMLElement, data: readonly object[], layout?: object, config?: object): Promise<HTMLElement>;
    purge(root: HTMLElement): void;
    Plots: { resize(root: HTMLElement): void };
  }
  const Plotly: PlotlyStatic;
  export default Plotly;
}
