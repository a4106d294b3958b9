// ECharts ships its locale objects as plain ES modules without type declarations; they have the shape of English's.
declare module 'echarts/lib/i18n/*.js' {
  const locale: Parameters<typeof import('echarts/core').registerLocale>[1];
  export default locale;
}
