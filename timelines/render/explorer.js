/* The timelines explorer: draws the chart of the page's data block (id "tl-data") in the
 * browser, with zoom, pan, filters, details and saving. Plain ES2020, no library.
 *
 * The data contract is the docstring of timelines/render/html.py. The page's
 * Content-Security-Policy allows this script and explorer.css only: so nothing here builds
 * markup from strings. Every text from the data goes into the page through textContent,
 * setAttribute of plain attributes, canvas fillText or XMLSerializer.
 *
 * Sections: data, calendar & ticks, geometry & lanes, state & URL hash, filters, painters
 * & record marks, overview, axis & main view, details, saving, controls, keyboard, start.
 */
(() => {
  "use strict";

  // ==========================================================================================
  // Data
  // ==========================================================================================

  // The data block holds JSON; a large table's is gzip-compressed and written in base64
  // (type "application/gzip"), which the HTML parser reads several times faster, and the
  // browser's own DecompressionStream turns back into the same JSON.
  readData(document.getElementById("tl-data")).then(explore, (error) => {
    const note = document.createElement("p");
    note.textContent = `The chart's data could not be read: ${error}`;
    document.getElementById("tl-app").appendChild(note);
    throw error;
  });

  async function readData(block) {
    if (block.type !== "application/gzip") return JSON.parse(block.textContent);
    const text = atob(block.textContent.trim());
    const bytes = new Uint8Array(text.length);
    for (let i = 0; i < text.length; i++) bytes[i] = text.charCodeAt(i);
    const stream = new Blob([bytes]).stream().pipeThrough(new DecompressionStream("gzip"));
    return JSON.parse(await new Response(stream).text());
  }

  function explore(DATA) {
  const COLUMNS = DATA.records || {};
  const N = (COLUMNS.label || []).length;
  const PALETTE = COLUMNS.palette || [];
  const GROUPS = DATA.groups || [];                  // [name, first lane, lanes]
  const COLORS = DATA.colors || [];                  // [value, #rrggbb]
  const QUALIFIER_NAMES = DATA.qualifierNames || [];
  // Days in the columns count from ORIGIN (shorter numbers, a smaller page); four per record.
  const ORIGIN = DATA.origin || 0;
  const SOURCES = DATA.sources || [];
  const EXPLANATIONS = DATA.explanations || {};
  const DOMAIN = [Number(DATA.domain[0]), Number(DATA.domain[1])];
  const DOMAIN_SPAN = DOMAIN[1] - DOMAIN[0];
  const ERA = DATA.era || "bce";
  const LANE_H = Number(DATA.laneHeight) || 22;
  const BAR_H = Math.min(Number(DATA.barHeight) || 12, LANE_H);
  const FONT_FAMILY = quotedFamily(DATA.fontFamily || "DejaVu Sans");

  // The look of the static chart (timelines/scene/theme.py and encodings.py).
  const TEXT_COLOR = "#1a1a1a";
  const LABEL_COLOR = "#333333";
  const MUTED_COLOR = "#666666";
  const GRID_COLOR = "#e3e3e3";
  const GRID_MINOR_COLOR = "#f0f0f0";
  const SEPARATOR_COLOR = "#bbbbbb";
  const FAR_OPACITY = 0.12;          // a fade at its far bound (theme.fringe_far_opacity)
  const STUB_NEAR = 0.55;            // an unknown stretch's fade (encodings.unknown_stretch)
  const STUB_FAR = FAR_OPACITY * 0.5;
  const LABEL_SIZE = 12;
  const SMALL_SIZE = 10;
  const LABEL_PAD = 4;
  const HEADER_H = 28;               // a group's header row
  const AXIS_H = 36;
  const OVERVIEW_H = 64;
  const OVERVIEW_PLOT_H = 44;        // the histogram; the year labels below it
  const PX_PER_TICK_LABEL = 90;
  const MIN_SPAN = 1;                // one day across the view
  const MAX_SPAN = 10 * DOMAIN_SPAN;
  // Plain wheel zooms, as ctrl+wheel (and a trackpad pinch) does; vertical scrolling of the
  // lanes is then by scroll bar, drag, keyboard. Set false to keep the plain wheel scrolling.
  const WHEEL_ZOOMS_WITHOUT_CTRL = true;

  // Bits of `flags`.
  const F_POINT = 1, F_CORE = 2, F_OPEN_START = 4, F_OPEN_END = 8;
  const F_STUB_START = 16, F_STUB_END = 32;       // a side with no far bound: drawn short
  // Bits of `signs`: the bracket of a 'before'/'after' limit on each side, the ~/? glyph.
  const S_BEFORE_START = 1, S_AFTER_START = 2, S_BEFORE_END = 4, S_AFTER_END = 8;
  const GLYPHS = ["", "~", "?", "~?"];

  // The columns as typed arrays: drawn bounds, extent (an open side reaches to infinity, so
  // it runs to whichever edge the view has), lanes, flags.
  const startLow = new Float64Array(N), startHigh = new Float64Array(N);
  const endLow = new Float64Array(N), endHigh = new Float64Array(N);
  const extentLow = new Float64Array(N), extentHigh = new Float64Array(N);
  const coreLow = new Float64Array(N), coreHigh = new Float64Array(N);
  const pointCentre = new Float64Array(N);
  const laneOf = new Int32Array(N), groupOf = new Int32Array(N);
  const fillOf = new Int32Array(N), colorValueOf = new Int32Array(N);
  const flags = new Uint8Array(N), signs = new Uint8Array(N), glyphOf = new Uint8Array(N);
  const qualifierBits = new Uint32Array(N);
  const labelWidth = new Float32Array(N).fill(-1);   // measured when first drawn

  function readColumns() {
    const drawn = COLUMNS.drawn, open = COLUMNS.open;
    const core = COLUMNS.core, point = COLUMNS.point;
    const lane = COLUMNS.lane, group = COLUMNS.group, fill = COLUMNS.fill;
    const colorValue = COLUMNS.colorValue, qualifiers = COLUMNS.qualifiers;
    const bit = (name) => { const at = QUALIFIER_NAMES.indexOf(name); return at < 0 ? 0 : 2 ** at; };
    const before = bit("before"), after = bit("after");
    const approximate = bit("approximate"), uncertain = bit("uncertain");
    for (let i = 0; i < N; i++) {
      const [e0, l0, e1, l1] = boundsOf(i);
      // Drawn days are written as their difference from the bound (from ORIGIN without one).
      const at = 4 * i;
      const a = (e0 === null ? ORIGIN : e0) + drawn[at];
      const b = (l0 === null ? ORIGIN : l0) + drawn[at + 1];
      const c = (e1 === null ? ORIGIN : e1) + drawn[at + 2];
      const d = (l1 === null ? ORIGIN : l1) + drawn[at + 3];
      startLow[i] = a; startHigh[i] = b; endLow[i] = c; endHigh[i] = d;
      let f = 0;
      if (open[i] & 1) f |= F_OPEN_START;
      if (open[i] & 2) f |= F_OPEN_END;
      if (core[i]) f |= F_CORE;
      if (point[i] && !(f & (F_OPEN_START | F_OPEN_END))) f |= F_POINT;   // as bars.py
      if (e0 === null && !(f & F_OPEN_START)) f |= F_STUB_START;
      if (l1 === null && !(f & F_OPEN_END)) f |= F_STUB_END;
      flags[i] = f;
      extentLow[i] = f & F_OPEN_START ? -Infinity : a;
      extentHigh[i] = f & F_OPEN_END ? Infinity : d;
      coreLow[i] = f & F_OPEN_START ? -Infinity : b;
      coreHigh[i] = f & F_OPEN_END ? Infinity : c;
      // A moment's marker: the middle of its window as written, else as drawn (bars.py).
      pointCentre[i] = ((e0 === null ? a : e0) + (l1 === null ? d : l1)) / 2;
      laneOf[i] = lane[i];
      groupOf[i] = group[i];
      fillOf[i] = fill[i];
      colorValueOf[i] = colorValue.length ? colorValue[i] : -1;   // [] when no colour column
      const q = qualifiers[i] >>> 0;
      qualifierBits[i] = q;
      // Which side a limit belongs to follows from the bound it leaves out: 'before X' has
      // no earliest bound, 'after X' no latest.
      let s = 0;
      if (q & before) {
        if (e0 === null && l0 !== null && !point[i]) s |= S_BEFORE_START;
        if (e1 === null && l1 !== null) s |= S_BEFORE_END;
      }
      if (q & after) {
        if (l0 === null && e0 !== null) s |= S_AFTER_START;
        if (l1 === null && e1 !== null && !point[i]) s |= S_AFTER_END;
      }
      signs[i] = s;
      // The sign left of the bar: ~ approximate, ? uncertain, ~? both (bars.qualifier_kind).
      glyphOf[i] = (q & approximate ? 1 : 0) + (q & uncertain ? 2 : 0);
    }
  }

  // A record's [start earliest, start latest, end earliest, end latest]; null: no bound.
  function boundsOf(i) {
    return daysOf(COLUMNS.bounds, i);
  }

  // The four days of record i in a column of steps: the first from ORIGIN, each other from
  // the last day known before it (explore.py writes the bounds so, to keep the page small).
  function daysOf(column, i) {
    const days = [null, null, null, null];
    let last = ORIGIN;
    for (let k = 0; k < 4; k++) {
      const step = column[4 * i + k];
      if (step === null) continue;
      last += step;
      days[k] = last;
    }
    return days;
  }

  // "file, row n, columns", as the static chart's tooltip says where a record came from.
  function sourceText(i) {
    const source = SOURCES[(COLUMNS.sourceOf || [])[i]] || ["", ""];
    const columns = source[1] ? `, ${source[1]}` : "";
    return `${source[0]}, row ${(COLUMNS.row || [])[i]}${columns}`;
  }

  // The record's id; the column is empty when no record has one.
  function idOf(i) {
    return (COLUMNS.id || [])[i] || "";
  }

  // The end as written; an end of null is the start's own cell.
  function endText(i) {
    const end = COLUMNS.end[i];
    return end === null ? COLUMNS.start[i] : end;
  }

  // Colours: the palette as rgb for fades, and a text colour that reads on each fill.
  const paletteRgb = PALETTE.map(hexRgb);
  const textOnFill = PALETTE.map((hex) => (contrastsWithWhite(hex) ? "#ffffff" : "#000000"));

  function hexRgb(hex) {
    const m = /^#?([0-9a-f]{6})$/i.exec(String(hex));
    const v = m ? parseInt(m[1], 16) : 0x0072b2;
    return [(v >> 16) & 255, (v >> 8) & 255, v & 255];
  }

  function contrastsWithWhite(hex) {
    // WCAG relative luminance, as theme.text_color_on.
    const lin = (c) => { c /= 255; return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4; };
    const [r, g, b] = hexRgb(hex);
    const l = 0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(b);
    return 1.05 / (l + 0.05) >= (l + 0.05) / 0.05;
  }

  function quotedFamily(name) {
    // One family name, quoted for CSS and canvas fonts; a generic fallback after it.
    const clean = String(name).replace(/["\\\n\r]/g, "");
    return `"${clean}", sans-serif`;
  }


  // ==========================================================================================
  // Calendar & ticks: a port of timelines/calendar.py and timelines/scene/scale.py. Tick days
  // and labels must equal Python's (the static chart's axis), so the same integer arithmetic
  // is used, with an exact floor division.
  // ==========================================================================================

  const GREGORIAN_REFORM = 577736;       // R.D. of 1582-10-15, the first Gregorian day
  const PRESENT_YEAR = 1950;             // "before present"
  const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun",
    "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

  function floorDiv(a, b) {
    // Python's a // b for integers (b > 0), exact where a / b would round.
    let q = Math.floor(a / b);
    const r = a - q * b;
    if (r < 0) q -= 1; else if (r >= b) q += 1;
    return q;
  }
  const mod = (a, b) => a - b * floorDiv(a, b);
  const ceilDiv = (a, b) => -floorDiv(-a, b);

  const isGregorianLeap = (y) => (mod(y, 4) === 0 && mod(y, 100) !== 0) || mod(y, 400) === 0;
  const isJulianLeap = (y) => mod(y, 4) === 0;
  const februaryCorrection = (m, leap) => (m <= 2 ? 0 : leap ? -1 : -2);

  function fixedFromGregorian(y, m, d) {
    const prior = y - 1;
    return 365 * prior + floorDiv(prior, 4) - floorDiv(prior, 100) + floorDiv(prior, 400)
      + floorDiv(367 * m - 362, 12) + februaryCorrection(m, isGregorianLeap(y)) + d;
  }

  function gregorianYearFromFixed(fixed) {
    const d0 = fixed - 1;
    const n400 = floorDiv(d0, 146097), d1 = mod(d0, 146097);
    const n100 = floorDiv(d1, 36524), d2 = mod(d1, 36524);
    const n4 = floorDiv(d2, 1461), d3 = mod(d2, 1461);
    const n1 = floorDiv(d3, 365);
    const year = 400 * n400 + 100 * n100 + 4 * n4 + n1;
    return n100 === 4 || n1 === 4 ? year : year + 1;
  }

  function gregorianFromFixed(fixed) {
    const year = gregorianYearFromFixed(fixed);
    let prior = fixed - fixedFromGregorian(year, 1, 1);
    if (fixed >= fixedFromGregorian(year, 3, 1)) prior += isGregorianLeap(year) ? 1 : 2;
    const month = floorDiv(12 * prior + 373, 367);
    return [year, month, fixed - fixedFromGregorian(year, month, 1) + 1];
  }

  function fixedFromJulian(y, m, d) {
    const prior = y - 1;
    return -2 + 365 * prior + floorDiv(prior, 4) + floorDiv(367 * m - 362, 12)
      + februaryCorrection(m, isJulianLeap(y)) + d;
  }

  function julianFromFixed(fixed) {
    let year = floorDiv(4 * (fixed + 1) + 1464, 1461);
    if (fixed < fixedFromJulian(year, 1, 1)) year -= 1;
    let prior = fixed - fixedFromJulian(year, 1, 1);
    if (fixed >= fixedFromJulian(year, 3, 1)) prior += isJulianLeap(year) ? 1 : 2;
    const month = floorDiv(12 * prior + 373, 367);
    return [year, month, fixed - fixedFromJulian(year, month, 1) + 1];
  }

  function isoFromFixed(fixed) {
    // calendar.iso_from_fixed: proleptic Gregorian, astronomical years, expanded outside 0..9999.
    const [y, m, d] = gregorianFromFixed(fixed);
    const tail = `-${String(m).padStart(2, "0")}-${String(d).padStart(2, "0")}`;
    if (y >= 0 && y <= 9999) return String(y).padStart(4, "0") + tail;
    return (y < 0 ? "-" : "+") + String(Math.abs(y)).padStart(4, "0") + tail;
  }

  // A calendar: { kind: "gregorian" | "julian" | "historical", reform: first Gregorian day }.
  function makeCalendar(kind, reform) {
    if (kind !== "julian" && kind !== "historical") return { kind: "gregorian" };
    if (kind === "julian") return { kind };
    const first = Number.isFinite(reform) ? reform : GREGORIAN_REFORM;
    return { kind, reform: first, lastJulian: julianFromFixed(first - 1),
      firstGregorian: gregorianFromFixed(first) };
  }

  function dateFromFixed(fixed, cal) {
    if (cal.kind === "julian") return julianFromFixed(fixed);
    if (cal.kind === "historical" && fixed < cal.reform) return julianFromFixed(fixed);
    return gregorianFromFixed(fixed);
  }

  const compareDates = (a, b) => a[0] - b[0] || a[1] - b[1] || a[2] - b[2];

  function fixedFromCalendar(y, m, d, cal) {
    if (cal.kind === "gregorian") return fixedFromGregorian(y, m, d);
    if (cal.kind === "julian") return fixedFromJulian(y, m, d);
    const date = [y, m, d];
    if (compareDates(date, cal.lastJulian) <= 0) return fixedFromJulian(y, m, d);
    if (compareDates(date, cal.firstGregorian) >= 0) return fixedFromGregorian(y, m, d);
    // A date the reform skipped (1 February 1918 in Russia): Python raises here; the axis
    // puts the month's tick on its first day that existed, the reform day.
    return cal.reform;
  }

  function groupDigits(digits) {
    return digits.replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  }

  function intWithCommas(n) {
    return (n < 0 ? "-" : "") + groupDigits(String(Math.abs(n)));
  }
  // Counts as "1,204" (Intl.NumberFormat would do, at the cost of loading locale data).
  const fmt = intWithCommas;

  function pythonG(x) {
    // Python's format(x, "g"): six significant digits, trailing zeros dropped.
    if (x === 0) return "0";
    const [mantissa, exponentText] = x.toExponential(5).split("e");
    const exponent = Number(exponentText);
    const strip = (s) => (s.includes(".") ? s.replace(/\.?0+$/, "") : s);
    if (exponent < -4 || exponent >= 6) {
      const sign = exponent < 0 ? "-" : "+";
      return `${strip(mantissa)}e${sign}${String(Math.abs(exponent)).padStart(2, "0")}`;
    }
    return strip(x.toFixed(5 - exponent));
  }

  function beforePresentLabel(years) {
    if (Math.abs(years) >= 1e6) return `${pythonG(years / 1e6)} Ma`;
    if (Math.abs(years) >= 1e5) return `${pythonG(years / 1000)} ka`;
    return Math.abs(years) >= 10000 ? `${intWithCommas(years)} BP` : `${years} BP`;
  }

  function yearLabel(year, style) {
    if (style === "astronomical" || year > 0) return String(year);
    return `${1 - year} ${style === "bc" ? "BC" : "BCE"}`;
  }

  function yearText(year, era, markCommonEra) {
    if (era === "bp") return beforePresentLabel(PRESENT_YEAR - year);
    const text = yearLabel(year, era).replace(/\d{5,}/g, groupDigits);
    if (markCommonEra && year > 0 && era !== "astronomical") {
      return era === "bce" ? `${text} CE` : `AD ${text}`;
    }
    return text;
  }

  function dateYearText(year, era) {
    // Beside a day and month a bare small year reads as a day: mark CE years below 1000.
    return yearText(year, era === "bp" ? "bce" : era, year > 0 && year < 1000);
  }

  const APPROXIMATE_DAYS = { day: 1, month: 365.2425 / 12, year: 365.2425 };

  const UNITS = (() => {
    const years = [];
    for (let e = 0; e < 12; e++) {
      for (const m of [1, 2, 5]) years.push(m * 10 ** e);
      years.push(25 * 10 ** e);
    }
    years.sort((a, b) => a - b);
    return [
      ...[1, 2, 5, 10, 15].map((step) => ({ kind: "day", step })),
      ...[1, 2, 3, 6].map((step) => ({ kind: "month", step })),
      ...years.map((step) => ({ kind: "year", step })),
    ].map((u) => ({ ...u, approx: u.step * APPROXIMATE_DAYS[u.kind] }));
  })();
  const unitOf = (kind, step) => UNITS.find((u) => u.kind === kind && u.step === step);

  function tickYears(step, first, last, era) {
    const years = [];
    if (era === "astronomical") {
      for (let y = ceilDiv(first, step) * step; y <= last; y += step) years.push(y);
      return years;
    }
    if (era === "bp") {
      const kLow = ceilDiv(PRESENT_YEAR - last, step), kHigh = floorDiv(PRESENT_YEAR - first, step);
      for (let k = kHigh; k >= kLow; k--) years.push(PRESENT_YEAR - k * step);
      return years;
    }
    // No year zero: BCE multiples of the step, the boundary year 1, CE multiples of the step
    // (leaving out one within half a step after year 1).
    let kLow = Math.max(1, ceilDiv(1 - last, step));
    let kHigh = floorDiv(1 - first, step);
    for (let k = kHigh; k >= kLow; k--) years.push(1 - k * step);
    if (first <= 1 && 1 <= last) years.push(1);
    kLow = Math.max(1, ceilDiv(first, step));
    kHigh = floorDiv(last, step);
    for (let k = kLow; k <= kHigh; k++) if (k * step - 1 > step / 2) years.push(k * step);
    return years;
  }

  function yearUnitTicks(step, first, last, era, cal) {
    const years = tickYears(step, dateFromFixed(first, cal)[0], dateFromFixed(last, cal)[0], era);
    return years.map((y) => ({ day: fixedFromCalendar(y, 1, 1, cal), label: yearText(y, era, y === 1) }));
  }

  function monthUnitTicks(step, first, last, era, cal) {
    let [y, m] = dateFromFixed(first, cal);
    const [lastY, lastM] = dateFromFixed(last, cal);
    const found = [];
    while (y < lastY || (y === lastY && m <= lastM)) {
      if ((m - 1) % step === 0) {
        found.push({ day: fixedFromCalendar(y, m, 1, cal), label: `${MONTHS[m - 1]} ${dateYearText(y, era)}` });
      }
      if (m === 12) { y += 1; m = 1; } else m += 1;
    }
    return found;
  }

  function dayUnitTicks(step, first, last, era, cal) {
    const found = [];
    for (let f = first; f <= last; f++) {
      const [y, m, d] = dateFromFixed(f, cal);
      if ((d - 1) % step === 0) found.push({ day: f, label: `${d} ${MONTHS[m - 1]} ${dateYearText(y, era)}` });
    }
    return found;
  }

  function unitTicks(unit, start, end, era, cal) {
    if (end < start) return [];
    const first = Math.floor(start), last = Math.floor(end);
    const make = unit.kind === "year" ? yearUnitTicks : unit.kind === "month" ? monthUnitTicks : dayUnitTicks;
    return make(unit.step, first, last, era, cal).filter((t) => start <= t.day && t.day <= end);
  }

  function chooseUnit(start, end, maxTicks, era, cal) {
    const span = end - start;
    for (const unit of UNITS) {
      // The cheap estimate first; its margin covers uneven spacing (as scale.choose_unit).
      if (span / unit.approx > 2 * (maxTicks + 1)) continue;
      if (unitTicks(unit, start, end, era, cal).length <= maxTicks) return unit;
    }
    return UNITS[UNITS.length - 1];
  }

  const MINOR_YEAR_STEPS = { 2: 1, 5: 1, 10: 2, 20: 5, 25: 5, 50: 10 };

  function minorUnit(unit) {
    if (unit.kind !== "year" || unit.step === 1) {
      const table = { "day 2": ["day", 1], "day 5": ["day", 1], "day 10": ["day", 5], "day 15": ["day", 5],
        "month 1": ["day", 5], "month 2": ["month", 1], "month 3": ["month", 1], "month 6": ["month", 1],
        "year 1": ["month", 3] };
      const found = table[`${unit.kind} ${unit.step}`];
      return found ? unitOf(...found) : null;
    }
    let mantissa = unit.step, factor = 1;
    while (mantissa >= 100) { mantissa = Math.floor(mantissa / 10); factor *= 10; }
    return unitOf("year", MINOR_YEAR_STEPS[mantissa] * factor);
  }

  // The axis ticks of [start, end]: majors (labelled) and, when asked, unlabelled minors.
  function axisTicks(start, end, maxTicks, era, cal, withMinor) {
    const unit = chooseUnit(start, end, maxTicks, era, cal);
    const majors = unitTicks(unit, start, end, era, cal);
    if (!withMinor) return { majors, minors: [] };
    const minor = minorUnit(unit);
    const taken = new Set(majors.map((t) => t.day));
    const minors = minor ? unitTicks(minor, start, end, era, cal).filter((t) => !taken.has(t.day)) : [];
    return { majors, minors };
  }

  const CALENDAR = makeCalendar(DATA.calendar, DATA.reform === null ? undefined : Number(DATA.reform));

  // A day as words at a precision: "12 Apr 1650", "Apr 1650", "1650".
  function dayText(day, precision) {
    const [y, m, d] = dateFromFixed(Math.floor(day), CALENDAR);
    if (precision === "year") return yearText(y, ERA, y === 1);
    if (precision === "month") return `${MONTHS[m - 1]} ${dateYearText(y, ERA)}`;
    return `${d} ${MONTHS[m - 1]} ${dateYearText(y, ERA)}`;
  }

  function rangeText(from, to) {
    const span = to - from;
    const precision = span < 120 ? "day" : span < 3650 ? "month" : "year";
    return `${dayText(from, precision)} to ${dayText(to, precision)}`;
  }

  // ==========================================================================================
  // Geometry & lanes: per lane, its records sorted by start (CSR arrays), with the running
  // maximum of their ends so a binary search finds the first one reaching into the view.
  // ==========================================================================================

  const LANES = Math.max(
    GROUPS.reduce((n, g) => Math.max(n, g[1] + g[2]), 0),
    N ? Math.max(...laneMaxima()) + 1 : 0);
  const laneGroup = new Int32Array(LANES);
  const laneFirst = new Int32Array(LANES + 1);     // laneItems[laneFirst[l] .. laneFirst[l+1])
  const laneItems = new Int32Array(N);
  const laneReach = new Float64Array(N);           // running max of extentHigh within a lane
  const orderOf = new Int32Array(N);               // position of a record in laneItems

  function laneMaxima() {
    // Math.max(...) of 100,000 values would overflow the call stack: reduce in chunks.
    const out = [];
    for (let i = 0; i < N; i += 10000) out.push(Math.max(...COLUMNS.lane.slice(i, i + 10000)));
    return out;
  }

  function buildLanes() {
    GROUPS.forEach(([, first, count], g) => {
      for (let l = first; l < first + count && l < LANES; l++) laneGroup[l] = g;
    });
    // Counting sort by lane, then each lane by start (then end, then data order).
    const counts = new Int32Array(LANES + 1);
    for (let i = 0; i < N; i++) counts[laneOf[i] + 1]++;
    for (let l = 0; l < LANES; l++) counts[l + 1] += counts[l];
    laneFirst.set(counts);
    const fill = counts.slice(0, LANES);
    for (let i = 0; i < N; i++) laneItems[fill[laneOf[i]]++] = i;
    const byStart = (a, b) => extentLow[a] - extentLow[b] || extentHigh[a] - extentHigh[b] || a - b;
    for (let l = 0; l < LANES; l++) {
      const lo = laneFirst[l], hi = laneFirst[l + 1];
      // Lanes hold few records: an insertion sort in place, no allocation; a long lane
      // goes through Array.prototype.sort.
      if (hi - lo > 32) laneItems.set(Array.from(laneItems.subarray(lo, hi)).sort(byStart), lo);
      else {
        for (let p = lo + 1; p < hi; p++) {
          const item = laneItems[p];
          let q = p - 1;
          while (q >= lo && byStart(laneItems[q], item) > 0) { laneItems[q + 1] = laneItems[q]; q--; }
          laneItems[q + 1] = item;
        }
      }
      let reach = -Infinity;
      for (let p = lo; p < hi; p++) {
        const i = laneItems[p];
        reach = Math.max(reach, extentHigh[i]);
        laneReach[p] = reach;
        orderOf[i] = p;
      }
    }
  }

  // The first position in a lane whose record may reach `day` or later.
  function firstReaching(lane, day) {
    let lo = laneFirst[lane], hi = laneFirst[lane + 1];
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (laneReach[mid] < day) lo = mid + 1; else hi = mid;
    }
    return lo;
  }

  // ==========================================================================================
  // State & URL hash
  // ==========================================================================================

  const TIME_MODES = ["all", "possibly", "certainly"];

  const state = {
    from: DOMAIN[0], to: DOMAIN[1],
    query: "",
    hiddenGroups: new Set(), hiddenColors: new Set(), quals: new Set(),
    time: "all",
    selected: -1, pinned: false, hover: -1,
    pendingTopLane: -1,          // a lane to scroll to once the layout is known
  };

  function clampRange(from, to) {
    let span = Math.min(Math.max(to - from, MIN_SPAN), MAX_SPAN);
    if (!Number.isFinite(span)) span = DOMAIN_SPAN;
    let centre = (from + to) / 2;
    if (!Number.isFinite(centre)) centre = (DOMAIN[0] + DOMAIN[1]) / 2;
    // Keep the view's centre on the chart's domain, so it cannot drift off into nothing.
    centre = Math.min(Math.max(centre, DOMAIN[0]), DOMAIN[1]);
    return [centre - span / 2, centre + span / 2];
  }

  function setRange(from, to) {
    [state.from, state.to] = clampRange(from, to);
    if (state.time !== "all") invalidate("time");
    invalidate("main", "axis", "brush", "hash");
  }

  function readHash() {
    const text = location.hash.replace(/^#/, "");
    if (!text) return;
    const params = new Map();
    for (const part of text.split("&")) {
      const at = part.indexOf("=");
      if (at < 0) continue;
      try {
        params.set(part.slice(0, at), decodeURIComponent(part.slice(at + 1).replace(/\+/g, " ")));
      } catch (error) { /* a malformed escape: leave that key out */ }
    }
    const numbers = (key) => (params.get(key) || "").split(",").filter((s) => s !== "").map(Number)
      .filter(Number.isInteger);
    const from = Number(params.get("from")), to = Number(params.get("to"));
    if (params.has("from") && params.has("to") && Number.isFinite(from) && Number.isFinite(to) && to > from) {
      [state.from, state.to] = clampRange(from, to);
    }
    state.query = params.get("q") || "";
    state.hiddenGroups = new Set(numbers("hide").filter((g) => g >= 0 && g < GROUPS.length));
    state.hiddenColors = new Set(numbers("hidec").filter((c) => c >= 0 && c < COLORS.length));
    state.quals = new Set((params.get("quals") || "").split(",").filter((q) => QUALIFIER_NAMES.includes(q)));
    state.time = TIME_MODES.includes(params.get("time")) ? params.get("time") : "all";
    const sel = Number(params.get("sel"));
    state.selected = params.has("sel") && Number.isInteger(sel) && sel >= 0 && sel < N ? sel : -1;
    state.pinned = state.selected >= 0;
    const top = Number(params.get("top"));
    state.pendingTopLane = params.has("top") && Number.isInteger(top) && top >= 0 && top < LANES ? top : -1;
  }

  function hashText() {
    const parts = [`from=${Math.round(state.from)}`, `to=${Math.round(state.to)}`];
    if (state.query) parts.push(`q=${encodeURIComponent(state.query)}`);
    if (state.hiddenGroups.size) parts.push(`hide=${[...state.hiddenGroups].sort((a, b) => a - b).join(",")}`);
    if (state.hiddenColors.size) parts.push(`hidec=${[...state.hiddenColors].sort((a, b) => a - b).join(",")}`);
    if (state.quals.size) parts.push(`quals=${QUALIFIER_NAMES.filter((q) => state.quals.has(q)).join(",")}`);
    if (state.time !== "all") parts.push(`time=${state.time}`);
    if (state.selected >= 0) parts.push(`sel=${state.selected}`);
    const top = topLane();
    if (top > 0) parts.push(`top=${top}`);
    return `#${parts.join("&")}`;
  }

  let hashTimer = 0;
  function writeHashSoon() {
    clearTimeout(hashTimer);
    hashTimer = setTimeout(() => {
      const text = hashText();
      if (text === location.hash) return;
      try { history.replaceState(null, "", text); } catch (error) { /* a sandboxed page */ }
    }, 150);
  }

  // ==========================================================================================
  // Filters: a record is shown when it passes every filter (AND): groups, colours, search,
  // qualifiers (the base filters, also behind the overview's histogram) and time. A lane
  // with no record shown folds away. The time filter follows the view as it pans, so its
  // lanes fold and unfold while panning: the lane at the top stays put meanwhile.
  //   possibly:  the record may reach into the view's range: its drawn extent, where an open
  //              side and a side without a far bound (an empty cell) reach without end;
  //   certainly: the record has a certain core and that core overlaps the view's range, i.e.
  //              it was certainly active at some time within the range.
  // ==========================================================================================

  const baseShown = new Uint8Array(N);
  const shown = new Uint8Array(N);
  let shownCount = 0, baseCount = 0;
  let searchText = null;        // lower-cased "label \u0000 id", built at the first search

  function computeBaseMask() {
    // Plain toLowerCase: Unicode-aware and the same on every machine (no locale data).
    const query = state.query.trim() ? state.query.trim().toLowerCase() : "";
    if (query && !searchText) {
      searchText = new Array(N);
      for (let i = 0; i < N; i++) {
        searchText[i] = `${COLUMNS.label[i]}\u0000${idOf(i)}`.toLowerCase();
      }
    }
    let need = 0;
    QUALIFIER_NAMES.forEach((name, at) => { if (state.quals.has(name)) need |= 2 ** at; });
    const groupsHidden = state.hiddenGroups.size > 0, colorsHidden = state.hiddenColors.size > 0;
    baseCount = 0;
    for (let i = 0; i < N; i++) {
      let ok = !(groupsHidden && state.hiddenGroups.has(groupOf[i]));
      if (ok && colorsHidden && colorValueOf[i] >= 0) ok = !state.hiddenColors.has(colorValueOf[i]);
      if (ok && need) ok = (qualifierBits[i] & need) === need;
      if (ok && query) ok = searchText[i].includes(query);
      baseShown[i] = ok ? 1 : 0;
      baseCount += ok ? 1 : 0;
    }
  }

  // How far a record may reach: a side with no far bound (an empty cell, 'before 1700' as a
  // start) is drawn short but may lie anywhere beyond, so it is possibly active there too.
  function possibleLow(i) {
    return flags[i] & F_STUB_START ? -Infinity : extentLow[i];
  }

  function possibleHigh(i) {
    return flags[i] & F_STUB_END ? Infinity : extentHigh[i];
  }

  function computeTimeMask() {
    const { from, to, time } = state;
    let count = 0;
    for (let i = 0; i < N; i++) {
      let ok = baseShown[i] === 1;
      if (ok && time === "possibly") ok = possibleLow(i) <= to && possibleHigh(i) >= from;
      else if (ok && time === "certainly") {
        ok = (flags[i] & F_CORE) !== 0 && coreLow[i] <= to && coreHigh[i] >= from;
      }
      shown[i] = ok ? 1 : 0;
      count += ok ? 1 : 0;
    }
    shownCount = count;
  }

  // ==========================================================================================
  // Rows: the main view's vertical layout. Each group with a lane left gets a header row,
  // then its lanes that hold a shown record.
  // ==========================================================================================

  const laneTop = new Float64Array(LANES).fill(-1);   // y of a lane's row; -1: folded away
  let rowLanes = new Int32Array(0);                   // the lanes laid out, top to bottom
  let headers = [];                                   // { group, y }
  let contentHeight = 0;

  function computeRows() {
    const has = new Uint8Array(LANES);
    for (let i = 0; i < N; i++) if (shown[i]) has[laneOf[i]] = 1;
    const lanes = [];
    headers = [];
    laneTop.fill(-1);
    let y = 0, lastGroup = -1;
    for (let l = 0; l < LANES; l++) {
      if (!has[l]) continue;
      if (laneGroup[l] !== lastGroup) {
        lastGroup = laneGroup[l];
        headers.push({ group: lastGroup, y });
        y += HEADER_H;
      }
      laneTop[l] = y;
      lanes.push(l);
      y += LANE_H;
    }
    rowLanes = Int32Array.from(lanes);
    contentHeight = y + 8;
  }

  // Index into rowLanes of the first lane whose row ends below y.
  function rowAt(y) {
    let lo = 0, hi = rowLanes.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (laneTop[rowLanes[mid]] + LANE_H <= y) lo = mid + 1; else hi = mid;
    }
    return lo;
  }

  // ==========================================================================================
  // Painters: one interface over a canvas and an SVG document, so the main view, the PNG and
  // the SVG draw records with the same code.
  // ==========================================================================================

  const fontOf = (size, weight) => `${weight || "normal"} ${size}px ${FONT_FAMILY}`;

  const rgbaCache = new Map();
  function rgba(fill, alpha) {
    const key = `${fill}|${alpha}`;
    let found = rgbaCache.get(key);
    if (!found) {
      const [r, g, b] = paletteRgb[fill] || hexRgb(fill);
      found = `rgba(${r},${g},${b},${Math.round(alpha * 1000) / 1000})`;
      rgbaCache.set(key, found);
    }
    return found;
  }
  const colorOf = (fill) => (typeof fill === "number" ? PALETTE[fill] || "#0072B2" : fill);

  const measureContext = document.createElement("canvas").getContext("2d");
  const measureCache = new Map();
  function measure(text, size, weight) {
    const key = `${size}|${weight || ""}|${text}`;
    let width = measureCache.get(key);
    if (width === undefined) {
      measureContext.font = fontOf(size, weight);
      width = measureContext.measureText(text).width;
      if (measureCache.size > 5000) measureCache.clear();
      measureCache.set(key, width);
    }
    return width;
  }

  function labelWidthOf(i) {
    if (labelWidth[i] < 0) {
      measureContext.font = fontOf(LABEL_SIZE);
      labelWidth[i] = measureContext.measureText(COLUMNS.label[i]).width;
    }
    return labelWidth[i];
  }

  function canvasPainter(ctx) {
    return {
      rect(x, y, w, h, fill, alpha) {
        ctx.fillStyle = alpha === undefined ? colorOf(fill) : rgba(fill, alpha);
        ctx.fillRect(x, y, w, h);
      },
      fade(x, y, w, h, fill, left, right) {
        const g = ctx.createLinearGradient(x, 0, x + w, 0);
        g.addColorStop(0, rgba(fill, left));
        g.addColorStop(1, rgba(fill, right));
        ctx.fillStyle = g;
        ctx.fillRect(x, y, w, h);
      },
      poly(points, fill, stroke, width, closed) {
        ctx.beginPath();
        ctx.moveTo(points[0], points[1]);
        for (let p = 2; p < points.length; p += 2) ctx.lineTo(points[p], points[p + 1]);
        if (closed) ctx.closePath();
        if (fill !== null) { ctx.fillStyle = colorOf(fill); ctx.fill(); }
        if (stroke) { ctx.strokeStyle = colorOf(stroke); ctx.lineWidth = width; ctx.stroke(); }
      },
      line(x1, y1, x2, y2, stroke, width, dash) {
        ctx.beginPath();
        ctx.moveTo(x1, y1);
        ctx.lineTo(x2, y2);
        ctx.strokeStyle = colorOf(stroke);
        ctx.lineWidth = width;
        if (dash) ctx.setLineDash(dash);
        ctx.stroke();
        if (dash) ctx.setLineDash([]);
      },
      text(x, y, text, size, weight, anchor, fill, halo) {
        ctx.font = fontOf(size, weight);
        ctx.textAlign = anchor === "end" ? "right" : anchor === "middle" ? "center" : "left";
        ctx.textBaseline = "alphabetic";
        if (halo) {
          ctx.strokeStyle = halo;
          ctx.lineWidth = 3;
          ctx.lineJoin = "round";
          ctx.strokeText(text, x, y);
        }
        ctx.fillStyle = colorOf(fill);
        ctx.fillText(text, x, y);
      },
    };
  }

  const SVG_NS = "http://www.w3.org/2000/svg";

  function svgPainter(doc, parent, defs) {
    const gradients = new Map();
    const make = (name, attributes) => {
      const node = doc.createElementNS(SVG_NS, name);
      for (const [key, value] of Object.entries(attributes)) node.setAttribute(key, String(value));
      return node;
    };
    const round = (v) => Math.round(v * 100) / 100;
    const paint = (fill) => colorOf(fill);
    // One gradient per colour and pair of opacities: objectBoundingBox units fit it to each
    // rect it fills, so thousands of fades share a few definitions.
    function gradient(fill, left, right) {
      const key = `${paint(fill)}|${left}|${right}`;
      let id = gradients.get(key);
      if (!id) {
        id = `fade${gradients.size}`;
        gradients.set(key, id);
        const g = make("linearGradient", { id, x1: 0, y1: 0, x2: 1, y2: 0 });
        g.appendChild(make("stop", { offset: 0, "stop-color": paint(fill), "stop-opacity": left }));
        g.appendChild(make("stop", { offset: 1, "stop-color": paint(fill), "stop-opacity": right }));
        defs.appendChild(g);
      }
      return id;
    }
    return {
      make,
      rect(x, y, w, h, fill, alpha) {
        const node = make("rect", { x: round(x), y: round(y), width: round(w), height: round(h), fill: paint(fill) });
        if (alpha !== undefined) node.setAttribute("fill-opacity", String(alpha));
        parent.appendChild(node);
      },
      fade(x, y, w, h, fill, left, right) {
        const id = gradient(fill, Math.round(left * 1000) / 1000, Math.round(right * 1000) / 1000);
        parent.appendChild(make("rect", { x: round(x), y: round(y), width: round(w), height: round(h), fill: `url(#${id})` }));
      },
      poly(points, fill, stroke, width, closed) {
        const pairs = [];
        for (let p = 0; p < points.length; p += 2) pairs.push(`${round(points[p])},${round(points[p + 1])}`);
        const node = make(closed ? "polygon" : "polyline", { points: pairs.join(" "), fill: fill === null ? "none" : paint(fill) });
        if (stroke) { node.setAttribute("stroke", paint(stroke)); node.setAttribute("stroke-width", String(width)); }
        parent.appendChild(node);
      },
      line(x1, y1, x2, y2, stroke, width, dash) {
        const node = make("line", { x1: round(x1), y1: round(y1), x2: round(x2), y2: round(y2), stroke: paint(stroke), "stroke-width": width });
        if (dash) node.setAttribute("stroke-dasharray", dash.join(" "));
        parent.appendChild(node);
      },
      text(x, y, text, size, weight, anchor, fill, halo) {
        // A halo is a stroked copy of the text under it, not paint-order: not every SVG
        // reader (cairosvg, some slide and drawing programs) knows paint-order.
        const layers = halo ? [[halo, true], [fill, false]] : [[fill, false]];
        for (const [colour, stroked] of layers) {
          const node = make("text", { x: round(x), y: round(y), "font-size": size, fill: paint(colour) });
          if (stroked) {
            for (const [k, v] of [["stroke", halo], ["stroke-width", 3], ["stroke-linejoin", "round"]]) node.setAttribute(k, String(v));
          }
          if (weight) node.setAttribute("font-weight", weight);
          if (anchor && anchor !== "start") node.setAttribute("text-anchor", anchor);
          node.textContent = text;
          parent.appendChild(node);
        }
      },
    };
  }

  // ==========================================================================================
  // Record marks, as the static chart draws them (timelines/scene/encodings.py): the core a
  // solid bar, each fringe fading out towards its far bound, an open side an arrowhead at the
  // view's edge, a side with no far bound a pale fade in a dashed outline, a moment a diamond
  // on its window's whisker, brackets at 'before'/'after' limits, ~ and ? left of the bar.
  // `view` = { from, k (px per day), width }; y is the bar's top.
  // ==========================================================================================

  const EDGE = 4;       // px beyond the view's edges that marks are clipped to

  // A fade from `x0` (opacity a0) to `x1` (a1), clipped to the view with its opacities
  // interpolated, so a fringe thousands of px wide draws as the part that shows.
  function clippedFade(p, x0, x1, y, h, fill, a0, a1, width) {
    if (!(x1 > x0)) return;
    const c0 = Math.max(x0, -EDGE), c1 = Math.min(x1, width + EDGE);
    if (c1 <= c0) return;
    const at = (x) => a0 + (a1 - a0) * ((x - x0) / (x1 - x0));
    p.fade(c0, y, c1 - c0, h, fill, at(c0), at(c1));
  }

  function clippedRect(p, x0, x1, y, h, fill, width) {
    const c0 = Math.max(x0, -EDGE), c1 = Math.min(x1, width + EDGE);
    if (c1 > c0) p.rect(c0, y, c1 - c0, h, fill);
  }

  // Where a record's marks begin and end on the page (px), for labels and outlines.
  function markBox(i, view) {
    const x = (day) => (day - view.from) * view.k;
    if (flags[i] & F_POINT) {
      const r = BAR_H * 0.55, cx = x(pointCentre[i]);
      return [Math.min(x(startLow[i]), cx - r), Math.max(x(endHigh[i]), cx + r)];
    }
    const reach = BAR_H * 0.7;
    const left = flags[i] & F_OPEN_START ? Math.max(x(extentLow[i]), -reach) : x(startLow[i]);
    let right = flags[i] & F_OPEN_END ? Math.min(x(extentHigh[i]), view.width + reach) : x(endHigh[i]);
    // A bracket's arm reaches a little past the bound it marks.
    const s = signs[i];
    if (s & S_BEFORE_END) right = Math.max(right, x(endHigh[i]) + 3);
    const low = s & S_AFTER_START ? Math.min(left, x(startLow[i]) - 3) : left;
    return [low, Math.max(right, low + 1)];
  }

  function drawRecordMarks(p, i, view, y) {
    const fill = fillOf[i], f = flags[i], w = view.width;
    const x = (day) => (day - view.from) * view.k;
    const middle = y + BAR_H / 2;
    if (f & F_POINT) {
      drawMoment(p, i, x, y, middle, fill, w);
      return;
    }
    const reach = BAR_H * 0.7;   // an open side's arrowhead (encodings.OPEN_ARROW_REACH)
    // The core: from the latest start to the earliest end.
    if (f & F_CORE) {
      let x0 = x(coreLow[i]), x1 = x(coreHigh[i]);
      if (f & F_OPEN_START) x0 = Math.max(x0, reach);
      if (f & F_OPEN_END) x1 = Math.min(x1, w - reach);
      clippedRect(p, x0, Math.max(x1, x0 + 1), y, BAR_H, fill, w);
    }
    // The start side: an arrow, a short unknown stretch, or a fade in from its far bound.
    if (f & F_OPEN_START) {
      if (extentHigh[i] > view.from) p.poly([reach, y - 2, 0, middle, reach, y + BAR_H + 2], fill, null, 0, true);
    } else if (f & F_STUB_START) {
      unknownStretch(p, x(startLow[i]), x(startHigh[i]), y, fill, "start", w);
    } else {
      clippedFade(p, x(startLow[i]), x(startHigh[i]) + 0.5, y, BAR_H, fill, FAR_OPACITY, 1, w);
    }
    if (f & F_OPEN_END) {
      if (extentLow[i] < view.to) p.poly([w - reach, y - 2, w, middle, w - reach, y + BAR_H + 2], fill, null, 0, true);
    } else if (f & F_STUB_END) {
      unknownStretch(p, x(endLow[i]), x(endHigh[i]), y, fill, "end", w);
    } else {
      clippedFade(p, x(endLow[i]) - 0.5, x(endHigh[i]), y, BAR_H, fill, 1, FAR_OPACITY, w);
    }
    drawBrackets(p, i, x, y);
    drawGlyph(p, i, x(startLow[i]), middle, f & F_OPEN_START);
  }

  function unknownStretch(p, x0, x1, y, fill, side, width) {
    if (!(x1 > x0)) return;
    const [a0, a1] = side === "start" ? [STUB_FAR, STUB_NEAR] : [STUB_NEAR, STUB_FAR];
    clippedFade(p, x0, x1, y, BAR_H, fill, a0, a1, width);
    const c0 = Math.max(x0, -EDGE), c1 = Math.min(x1, width + EDGE);
    if (c1 <= c0) return;
    p.line(c0, y + 0.5, c1, y + 0.5, fill, 1, [3, 2]);
    p.line(c0, y + BAR_H - 0.5, c1, y + BAR_H - 0.5, fill, 1, [3, 2]);
  }

  function drawMoment(p, i, x, y, middle, fill, width) {
    const x0 = x(startLow[i]), x1 = x(endHigh[i]);
    const cap = BAR_H * 0.35;
    if (x1 - x0 > 0) {
      p.line(Math.max(x0, -EDGE), middle, Math.min(x1, width + EDGE), middle, fill, 1.5);
      for (const at of [x0, x1]) if (at >= -EDGE && at <= width + EDGE) p.line(at, middle - cap, at, middle + cap, fill, 1.5);
    }
    const cx = x(pointCentre[i]), r = BAR_H * 0.55;
    if (cx >= -r && cx <= width + r) p.poly([cx, middle - r, cx + r, middle, cx, middle + r, cx - r, middle], fill, "#ffffff", 0.75, true);
    drawBrackets(p, i, x, y);
    drawGlyph(p, i, Math.min(x0, cx - r), middle, false);
  }

  function drawBrackets(p, i, x, y) {
    const s = signs[i];
    if (!s) return;
    const bracket = (day, arm) => {
      const at = x(day), top = y - 2, bottom = y + BAR_H + 2;
      p.poly([at - arm, top, at, top, at, bottom, at - arm, bottom], null, TEXT_COLOR, 1.5, false);
    };
    if (s & S_BEFORE_START) bracket(startHigh[i], 3.5);
    if (s & S_AFTER_START) bracket(startLow[i], -3.5);
    if (s & S_BEFORE_END) bracket(endHigh[i], 3.5);
    if (s & S_AFTER_END) bracket(endLow[i], -3.5);
  }

  function glyphWidth(i) {
    return glyphOf[i] ? measure(GLYPHS[glyphOf[i]], SMALL_SIZE, "bold") + 3 : 0;
  }

  function drawGlyph(p, i, leftX, middle, isOpen) {
    if (!glyphOf[i] || isOpen) return;
    p.text(leftX - 2, middle + SMALL_SIZE * 0.36, GLYPHS[glyphOf[i]], SMALL_SIZE, "bold", "end", TEXT_COLOR);
  }

  // Draws one lane's shown records that reach into the view, then their labels: right of the
  // bar, else left of it, else inside the part of the core that shows, else cut short with an
  // ellipsis where at least a few letters fit.
  function drawLane(p, lane, y, view) {
    const labelReach = 320 / view.k;    // a label can show for a bar just outside the view
    const dayLow = view.from - labelReach, dayHigh = view.to + labelReach;
    const items = [];
    for (let at = firstReaching(lane, dayLow), end = laneFirst[lane + 1]; at < end; at++) {
      const i = laneItems[at];
      if (extentLow[i] > dayHigh) break;
      if (!shown[i]) continue;
      if (extentHigh[i] < dayLow) continue;
      items.push(i);
    }
    const barY = y + (LANE_H - BAR_H) / 2;
    for (const i of items) drawRecordMarks(p, i, view, barY);
    drawLabels(p, items, view, barY);
    return items;
  }

  function drawLabels(p, items, view, barY) {
    const baseline = barY + BAR_H / 2 + LABEL_SIZE * 0.36;
    const boxes = items.map((i) => markBox(i, view));
    let used = -Infinity;     // the right edge of what is already drawn in this lane
    items.forEach((i, n) => {
      const [left, right] = boxes[n];
      const label = COLUMNS.label[i];
      used = Math.max(used, n > 0 ? boxes[n - 1][1] : -Infinity);
      if (!label) { used = Math.max(used, right); return; }
      const width = labelWidthOf(i);
      const next = n + 1 < items.length ? boxes[n + 1][0] - glyphWidth(items[n + 1]) : Infinity;
      const roomRight = Math.min(next, view.width) - LABEL_PAD - (right + LABEL_PAD);
      const leftEdge = left - glyphWidth(i) - LABEL_PAD;
      const roomLeft = leftEdge - Math.max(used + LABEL_PAD, 0);
      if (right >= 0 && width <= roomRight) {
        p.text(right + LABEL_PAD, baseline, label, LABEL_SIZE, null, "start", LABEL_COLOR);
        used = right + LABEL_PAD + width;
      } else if (left <= view.width && width <= roomLeft) {
        p.text(leftEdge, baseline, label, LABEL_SIZE, null, "end", LABEL_COLOR);
      } else if (!insideLabel(p, i, label, width, view, barY, baseline, right)) {
        if (right >= 0 && roomRight >= 40) {
          const cut = fitText(label, roomRight);
          p.text(right + LABEL_PAD, baseline, cut, LABEL_SIZE, null, "start", LABEL_COLOR);
          used = right + LABEL_PAD + roomRight;
        }
      }
      used = Math.max(used, right);
    });
  }

  // A label on the bar where neither side has room (a bar across the whole view): inside the
  // core in the colour that reads on it, else over the fringes, dark with a white halo.
  function insideLabel(p, i, label, width, view, barY, baseline) {
    if (flags[i] & F_POINT) return false;
    const reach = BAR_H * 0.7;    // clear of an open side's arrowhead
    const leftLimit = flags[i] & F_OPEN_START ? reach : 0;
    const rightLimit = view.width - (flags[i] & F_OPEN_END ? reach : 0);
    const fits = (x0, x1) => x1 - x0 >= Math.min(width, 60);
    const place = (x0, x1, fill, halo) => {
      const text = width <= x1 - x0 ? label : fitText(label, x1 - x0);
      p.text(x0, baseline, text, LABEL_SIZE, null, "start", fill, halo);
      return true;
    };
    if (flags[i] & F_CORE) {
      const x0 = Math.max((coreLow[i] - view.from) * view.k, leftLimit) + LABEL_PAD;
      const x1 = Math.min((coreHigh[i] - view.from) * view.k, rightLimit) - LABEL_PAD;
      if (fits(x0, x1)) return place(x0, x1, textOnFill[fillOf[i]] || "#ffffff");
    }
    const [left, right] = markBox(i, view);
    const x0 = Math.max(left, leftLimit) + LABEL_PAD, x1 = Math.min(right, rightLimit) - LABEL_PAD;
    return fits(x0, x1) ? place(x0, x1, TEXT_COLOR, "rgba(255,255,255,0.85)") : false;
  }

  function fitText(text, room) {
    if (measure(text, LABEL_SIZE) <= room) return text;
    let lo = 0, hi = text.length;
    while (lo < hi) {
      const mid = (lo + hi + 1) >>> 1;
      if (measure(`${text.slice(0, mid)}…`, LABEL_SIZE) <= room) lo = mid; else hi = mid - 1;
    }
    return `${text.slice(0, lo)}…`;
  }

  // Axis ticks along [from, to] at a given width, cached: the axis, the grid and the export
  // all ask for the same.
  let tickCache = { key: "", value: null };
  function viewTicks(from, to, width) {
    const maxTicks = Math.max(1, Math.floor(width / PX_PER_TICK_LABEL));
    const key = `${from}|${to}|${maxTicks}`;
    if (tickCache.key !== key) tickCache = { key, value: axisTicks(from, to, maxTicks, ERA, CALENDAR, true) };
    return tickCache.value;
  }

  function drawAxisOn(p, view, top, height) {
    const { majors, minors } = viewTicks(view.from, view.to, view.width);
    const x = (day) => (day - view.from) * view.k;
    p.rect(0, top, view.width, height, "#ffffff");
    p.line(0, top + height - 0.5, view.width, top + height - 0.5, SEPARATOR_COLOR, 1);
    for (const t of minors) {
      const at = Math.round(x(t.day)) + 0.5;
      p.line(at, top + height - 5, at, top + height, MUTED_COLOR, 1);
    }
    for (const t of majors) {
      const at = Math.round(x(t.day)) + 0.5;
      p.line(at, top + height - 10, at, top + height, TEXT_COLOR, 1);
      const w = measure(t.label, 11);
      const centre = Math.min(Math.max(at, w / 2 + 2), view.width - w / 2 - 2);
      p.text(centre, top + height - 15, t.label, 11, null, "middle", TEXT_COLOR);
    }
  }

  function drawGrid(p, view, top, height) {
    const { majors, minors } = viewTicks(view.from, view.to, view.width);
    const x = (day) => (day - view.from) * view.k;
    // Beyond the chart's domain (zoomed out past it): a faint ground, so the edge shows.
    const d0 = x(DOMAIN[0]), d1 = x(DOMAIN[1]);
    if (d0 > 0) p.rect(0, top, Math.min(d0, view.width), height, "#f6f6f6");
    if (d1 < view.width) p.rect(Math.max(d1, 0), top, view.width - Math.max(d1, 0), height, "#f6f6f6");
    const minorGap = minors.length > 1 ? (minors[1].day - minors[0].day) * view.k : 0;
    if (minorGap > 6) {
      for (const t of minors) { const at = Math.round(x(t.day)) + 0.5; p.line(at, top, at, top + height, GRID_MINOR_COLOR, 1); }
    }
    for (const t of majors) { const at = Math.round(x(t.day)) + 0.5; p.line(at, top, at, top + height, GRID_COLOR, 1); }
  }

  function drawHeader(p, group, y, width, withLine) {
    if (withLine) p.line(0, y + 0.5, width, y + 0.5, SEPARATOR_COLOR, 1);
    const name = GROUPS[group] ? GROUPS[group][0] : "";
    if (name) p.text(8, y + HEADER_H / 2 + 12 * 0.36 + 2, name, 12, "bold", "start", TEXT_COLOR);
  }

  // ==========================================================================================
  // The page: elements built once, then drawn into.
  // ==========================================================================================

  const app = document.getElementById("tl-app");
  const el = (tag, attributes, text) => {
    const node = document.createElement(tag);
    for (const [key, value] of Object.entries(attributes || {})) node.setAttribute(key, String(value));
    if (text !== undefined) node.textContent = text;
    return node;
  };
  const ui = {};

  function buildPage() {
    app.style.fontFamily = FONT_FAMILY;
    const header = el("header", { class: "tl-header" });
    const title = document.getElementById("tl-title"), summary = document.getElementById("tl-summary");
    if (title) header.appendChild(title);
    if (summary) header.appendChild(summary);
    app.insertBefore(header, app.firstChild);
    app.appendChild(buildToolbar());
    app.appendChild(buildLegend());
    const view = el("div", { class: "tl-view" });
    view.appendChild(buildOverview());
    view.appendChild(buildMain());
    app.appendChild(view);
    app.appendChild(buildDetails());
  }

  function buildToolbar() {
    const bar = el("div", { class: "tl-toolbar", role: "toolbar", "aria-label": "Chart controls" });
    const search = el("div", { class: "tl-field" });
    search.appendChild(el("label", { for: "tl-search" }, "Search"));
    ui.search = el("input", { type: "search", id: "tl-search", "aria-label": "Search labels and ids",
      placeholder: "label or id  ( / )", autocomplete: "off", spellcheck: "false" });
    search.appendChild(ui.search);
    bar.appendChild(search);

    const time = el("div", { class: "tl-field" });
    time.appendChild(el("label", { for: "tl-time-mode" }, "Time"));
    ui.time = el("select", { id: "tl-time-mode", "aria-label": "Show records by time" });
    for (const [value, text] of [["all", "all records"], ["possibly", "possibly active in view"],
      ["certainly", "certainly active in view"]]) ui.time.appendChild(el("option", { value }, text));
    time.appendChild(ui.time);
    bar.appendChild(time);

    bar.appendChild(buildQualifierMenu());

    const zoom = el("div", { class: "tl-buttons", role: "group", "aria-label": "Zoom" });
    ui.zoomOut = el("button", { type: "button", id: "tl-zoom-out", "aria-label": "Zoom out", title: "Zoom out (-)" }, "−");
    ui.zoomIn = el("button", { type: "button", id: "tl-zoom-in", "aria-label": "Zoom in", title: "Zoom in (+)" }, "+");
    ui.reset = el("button", { type: "button", id: "tl-reset", "aria-label": "Show the whole time range", title: "Whole time range" }, "Whole range");
    zoom.append(ui.zoomOut, ui.zoomIn, ui.reset);
    bar.appendChild(zoom);

    const save = el("div", { class: "tl-buttons", role: "group", "aria-label": "Save" });
    save.appendChild(el("span", { class: "tl-group-label", "aria-hidden": "true" }, "Save"));
    ui.saveSvg = el("button", { type: "button", id: "tl-save-svg", "aria-label": "Save the view as SVG" }, "SVG");
    ui.savePng = el("button", { type: "button", id: "tl-save-png", "aria-label": "Save the view as PNG" }, "PNG");
    ui.saveCsv = el("button", { type: "button", id: "tl-save-csv", "aria-label": "Save the shown records as CSV" }, "CSV");
    save.append(ui.saveSvg, ui.savePng, ui.saveCsv);
    bar.appendChild(save);

    ui.count = el("output", { id: "tl-count", "aria-live": "polite", "aria-label": "Records shown" });
    bar.appendChild(ui.count);
    return bar;
  }

  const QUALIFIER_WORDS = {
    approximate: "approximate (~, c.)", uncertain: "uncertain (?)", open: "open (runs on)",
    before: "before a date", after: "after a date", unknown: "a date not recorded",
    convention_dependent: "depends on a convention", one_of: "one of several dates",
  };

  function buildQualifierMenu() {
    // A disclosure (<details>): eight checkboxes would crowd the toolbar.
    const menu = el("details", { class: "tl-menu" });
    ui.qualSummary = el("summary", {}, "Only records that are…");
    menu.appendChild(ui.qualSummary);
    const box = el("fieldset", { class: "tl-menu-body" });
    box.appendChild(el("legend", {}, "Only records with every checked sign"));
    ui.quals = {};
    for (const name of QUALIFIER_NAMES) {
      const id = `tl-q-${name}`;
      const row = el("div", { class: "tl-check" });
      const input = el("input", { type: "checkbox", id, "data-name": name });
      row.append(input, el("label", { for: id }, QUALIFIER_WORDS[name] || name.replace(/_/g, " ")));
      ui.quals[name] = input;
      box.appendChild(row);
    }
    menu.appendChild(box);
    return menu;
  }

  function buildLegend() {
    const legend = el("div", { id: "tl-legend", class: "tl-legend" });
    const counts = new Int32Array(GROUPS.length);
    for (let i = 0; i < N; i++) if (groupOf[i] < counts.length) counts[groupOf[i]]++;
    ui.groupToggles = [];
    if (GROUPS.length > 1) {
      const row = el("div", { class: "tl-legend-row", role: "group", "aria-label": "Groups: press to hide or show" });
      row.appendChild(el("span", { class: "tl-legend-title", "aria-hidden": "true" }, "Groups"));
      GROUPS.forEach(([name], g) => {
        const button = el("button", { type: "button", class: "tl-group-toggle", "data-index": g, "aria-pressed": "true",
          "aria-label": `${name || "(no group)"}, ${fmt(counts[g])} records` });
        button.append(el("span", { class: "tl-toggle-name" }, name || "(no group)"),
          el("span", { class: "tl-toggle-count", "aria-hidden": "true" }, fmt(counts[g])));
        ui.groupToggles.push(button);
        row.appendChild(button);
      });
      legend.appendChild(row);
    }
    ui.colorToggles = [];
    if (COLORS.length) {
      const title = DATA.colorTitle || "Colour";
      const row = el("div", { class: "tl-legend-row", role: "group", "aria-label": `${title}: press to hide or show` });
      row.appendChild(el("span", { class: "tl-legend-title", "aria-hidden": "true" }, title));
      COLORS.forEach(([value, hex], c) => {
        const button = el("button", { type: "button", class: "tl-color-toggle", "data-index": c, "aria-pressed": "true",
          "aria-label": `${title} ${value}` });
        const swatch = el("span", { class: "tl-swatch", "aria-hidden": "true" });
        swatch.style.backgroundColor = /^#[0-9a-f]{6}$/i.test(hex) ? hex : "#888888";
        button.append(swatch, el("span", { class: "tl-toggle-name" }, value));
        ui.colorToggles.push(button);
        row.appendChild(button);
      });
      legend.appendChild(row);
    }
    if (!legend.childNodes.length) legend.hidden = true;
    return legend;
  }

  function buildOverview() {
    const wrap = el("div", { class: "tl-overview-wrap" });
    ui.overview = el("canvas", { id: "tl-overview", tabindex: 0, role: "slider",
      "aria-label": "Overview of the whole time range; the frame is the range shown below. Arrow keys move it.",
      "aria-valuemin": Math.round(DOMAIN[0]), "aria-valuemax": Math.round(DOMAIN[1]) });
    wrap.appendChild(ui.overview);
    return wrap;
  }

  function buildMain() {
    ui.main = el("div", { id: "tl-main", tabindex: 0, role: "application", "aria-roledescription": "timeline",
      "aria-label": (DATA.description || DATA.title || "Timeline").trim(),
      "aria-describedby": "tl-keys" });
    ui.axis = el("canvas", { id: "tl-axis", "aria-hidden": "true" });
    ui.lanes = el("canvas", { id: "tl-lanes", "aria-hidden": "true" });
    ui.spacer = el("div", { class: "tl-spacer", "aria-hidden": "true" });
    ui.main.append(ui.axis, ui.lanes, ui.spacer);
    return ui.main;
  }

  function buildDetails() {
    ui.details = el("aside", { id: "tl-details", "aria-live": "polite", "aria-label": "Record details" });
    ui.detailsBody = el("div", { class: "tl-details-body" });
    const help = el("p", { id: "tl-keys", class: "tl-help" },
      "Keys in the chart: + and − zoom, ← → pan, ↑ ↓ previous or next record, Home and End the first and "
      + "last, Enter pins the details, Escape unpins; / goes to the search. Drag to pan, wheel to zoom, "
      + "shift+wheel to pan.");
    ui.details.append(ui.detailsBody, help);
    return ui.details;
  }

  // ==========================================================================================
  // Main view: drawing, requestAnimationFrame-coalesced, only what changed.
  // ==========================================================================================

  const dirty = new Set();
  let frame = 0;
  const api = { ready: false, redrawCount: 0 };

  function invalidate(...parts) {
    for (const part of parts) dirty.add(part);
    if (!frame) frame = requestAnimationFrame(flush);
  }

  function flush() {
    frame = 0;
    // After a filter change the view goes back to the top; after a pan or zoom with the time
    // filter on, the lane at the top stays there.
    let anchor = -1;
    if (dirty.has("filters")) { computeBaseMask(); dirty.add("rows").add("time").add("histogram"); }
    else if (dirty.has("time")) { anchor = topLane(); dirty.add("rows"); }
    if (dirty.has("time")) { computeTimeMask(); dirty.add("main").add("count"); }
    if (dirty.has("rows")) { rebuildRows(anchor); dirty.add("main").add("hash"); }
    if (dirty.has("histogram")) { computeHistogram(); dirty.add("brush"); }
    if (dirty.has("axis")) drawAxis();
    if (dirty.has("main")) drawMain();
    if (dirty.has("brush")) drawOverview();
    if (dirty.has("count")) updateCount();
    if (dirty.has("details")) updateDetails();
    if (dirty.has("hash")) writeHashSoon();
    dirty.clear();
  }

  function rebuildRows(anchor) {
    const offset = anchor >= 0 ? ui.main.scrollTop - laneTop[anchor] : 0;
    const fromHash = state.pendingTopLane >= 0;    // layoutMain scrolls to it
    computeRows();
    layoutMain();
    if (fromHash) return;
    if (anchor < 0) ui.main.scrollTop = 0;
    else scrollToLane(anchor, offset);
  }

  // Scrolls a lane to the top of the view (`offset` px into it), or the first lane shown
  // below it when it is folded away.
  function scrollToLane(lane, offset) {
    let lo = 0, hi = rowLanes.length;
    while (lo < hi) { const mid = (lo + hi) >>> 1; if (rowLanes[mid] < lane) lo = mid + 1; else hi = mid; }
    if (lo >= rowLanes.length) return;
    const found = rowLanes[lo];
    ui.main.scrollTop = laneTop[found] + (found === lane ? Math.max(Math.min(offset, LANE_H), 0) : 0);
  }

  const canvasSize = { width: 0, lanesHeight: 0, overviewWidth: 0 };

  const cssSizes = new WeakMap();

  function sizeCanvas(canvas, width, height) {
    const ratio = window.devicePixelRatio || 1;
    const w = Math.max(1, Math.round(width * ratio)), h = Math.max(1, Math.round(height * ratio));
    if (canvas.width !== w || canvas.height !== h) { canvas.width = w; canvas.height = h; }
    // Written only on a change: a style write each frame would cost a layout each frame.
    const css = `${width}x${height}`;
    if (cssSizes.get(canvas) !== css) {
      cssSizes.set(canvas, css);
      canvas.style.width = `${width}px`;
      canvas.style.height = `${height}px`;
    }
    const ctx = canvas.getContext("2d");
    ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
    return ctx;
  }

  function layoutMain() {
    const height = Math.max(ui.main.clientHeight, AXIS_H + LANE_H);
    canvasSize.lanesHeight = height - AXIS_H;
    // The spacer makes the scroll height that of all rows; the two canvases stay put (sticky).
    // Sized before the width is read: the scroll bar it brings takes width.
    const spacer = `${Math.max(contentHeight - canvasSize.lanesHeight, 0)}px`;
    if (ui.spacer.style.height !== spacer) ui.spacer.style.height = spacer;
    const width = Math.max(ui.main.clientWidth, 100);
    canvasSize.width = width;
    sizeCanvas(ui.axis, width, AXIS_H);
    sizeCanvas(ui.lanes, width, canvasSize.lanesHeight);
    if (state.pendingTopLane >= 0 && rowLanes.length) {   // once the rows are known
      scrollToLane(state.pendingTopLane, 0);
      state.pendingTopLane = -1;
    }
    const overviewWidth = Math.max(ui.overview.parentNode.clientWidth, 100);
    if (overviewWidth !== canvasSize.overviewWidth) { canvasSize.overviewWidth = overviewWidth; dirty.add("histogram"); }
  }

  const currentView = () => {
    const width = canvasSize.width;
    return { from: state.from, to: state.to, width, k: width / (state.to - state.from) };
  };

  function topLane() {
    if (!rowLanes.length) return 0;
    const at = rowAt(ui.main ? ui.main.scrollTop : 0);
    return at < rowLanes.length ? rowLanes[at] : rowLanes[rowLanes.length - 1];
  }

  function drawAxis() {
    const ctx = ui.axis.getContext("2d");
    drawAxisOn(canvasPainter(ctx), currentView(), 0, AXIS_H);
  }

  function drawMain() {
    api.redrawCount += 1;
    const ctx = ui.lanes.getContext("2d");
    const view = currentView(), height = canvasSize.lanesHeight;
    const p = canvasPainter(ctx);
    const scroll = ui.main.scrollTop;
    ctx.clearRect(0, 0, view.width, height);
    p.rect(0, 0, view.width, height, "#ffffff");
    drawGrid(p, view, 0, height);
    // Group headers in the viewport (a separator above each but the first).
    for (const h of headers) {
      const y = h.y - scroll;
      if (y > height || y + HEADER_H < 0) continue;
      drawHeader(p, h.group, y, view.width, h.y > 0);
    }
    const first = rowAt(scroll);
    const selectedLane = state.selected >= 0 && shown[state.selected] ? laneOf[state.selected] : -1;
    for (let r = first; r < rowLanes.length; r++) {
      const lane = rowLanes[r], y = laneTop[lane] - scroll;
      if (y > height) break;
      if (lane === selectedLane) p.rect(0, y, view.width, LANE_H, "#000000", 0.045);
      drawLane(p, lane, y, view);
    }
    drawFocus(ctx, view, scroll);
    drawStickyHeader(p, view, scroll, first);
    if (!rowLanes.length) {
      p.text(view.width / 2, 40, N ? "No records match the filters." : "No dated records.", 13, null, "middle", MUTED_COLOR);
    }
  }

  // The group of the top lane stays named while its header is scrolled away.
  function drawStickyHeader(p, view, scroll, first) {
    if (first >= rowLanes.length) return;
    const group = laneGroup[rowLanes[first]];
    const header = headers.find((h) => h.group === group);
    if (!header || header.y >= scroll) return;
    const name = GROUPS[group] ? GROUPS[group][0] : "";
    if (!name) return;
    const width = measure(name, 12, "bold") + 20;
    p.rect(0, 0, width, 22, "#ffffff", 0.92);
    p.line(0, 22.5, width, 22.5, SEPARATOR_COLOR, 1);
    p.text(8, 15, name, 12, "bold", "start", TEXT_COLOR);
  }

  function drawFocus(ctx, view, scroll) {
    for (const [i, strong] of [[state.hover, false], [state.selected, true]]) {
      if (i < 0 || !shown[i] || laneTop[laneOf[i]] < 0 || (!strong && i === state.selected)) continue;
      const y = laneTop[laneOf[i]] - scroll + (LANE_H - BAR_H) / 2;
      const [left, right] = markBox(i, view);
      const x0 = Math.max(left - 4, -2), x1 = Math.min(right + 4, view.width + 2);
      if (x1 < 0 || x0 > view.width) continue;
      ctx.save();
      ctx.strokeStyle = strong ? TEXT_COLOR : "#777777";
      ctx.lineWidth = strong ? 2 : 1;
      ctx.setLineDash(strong ? [] : [3, 2]);
      ctx.strokeRect(Math.round(x0) + 0.5, Math.round(y - 4) + 0.5, Math.round(x1 - x0), BAR_H + 8);
      ctx.restore();
    }
  }

  function updateCount() {
    const text = `${fmt(shownCount)} of ${fmt(N)} shown`;
    if (ui.count.textContent !== text) ui.count.textContent = text;
  }

  // ==========================================================================================
  // Overview: a histogram of the whole domain (records possibly active per pixel column
  // light, certainly active dark, of those passing the base filters) with the view's range
  // as a brush. The histogram is worked out once per filter change, as two paths.
  // ==========================================================================================

  let histogram = { possible: null, certain: null, ticks: [] };

  function computeHistogram() {
    const width = canvasSize.overviewWidth;
    const bins = Math.max(1, Math.round(width));
    const possible = new Float64Array(bins + 1), certain = new Float64Array(bins + 1);
    const scale = bins / DOMAIN_SPAN, d0 = DOMAIN[0], d1 = DOMAIN[1], lastBin = bins - 1;
    // Difference arrays: +1 where a record's range begins, -1 after it ends: O(N + bins).
    for (let i = 0; i < N; i++) {
      if (!baseShown[i]) continue;
      const low = extentLow[i], high = extentHigh[i];
      if (high < d0 || low > d1) continue;
      possible[low <= d0 ? 0 : Math.min(Math.floor((low - d0) * scale), lastBin)] += 1;
      possible[high >= d1 ? bins : Math.min(Math.floor((high - d0) * scale), lastBin) + 1] -= 1;
      if ((flags[i] & F_CORE) && coreHigh[i] >= coreLow[i]) {
        const cl = coreLow[i], ch = coreHigh[i];
        certain[cl <= d0 ? 0 : Math.min(Math.floor((cl - d0) * scale), lastBin)] += 1;
        certain[ch >= d1 ? bins : Math.min(Math.floor((ch - d0) * scale), lastBin) + 1] -= 1;
      }
    }
    let most = 0;
    for (let b = 1; b <= bins; b++) { possible[b] += possible[b - 1]; certain[b] += certain[b - 1]; }
    for (let b = 0; b < bins; b++) most = Math.max(most, possible[b]);
    const columnWidth = width / bins;
    const path = (counts) => {
      const shape = new Path2D();
      if (!most) return shape;
      for (let b = 0; b < bins; b++) {
        if (!counts[b]) continue;
        const h = Math.max(1, (counts[b] / most) * (OVERVIEW_PLOT_H - 4));
        shape.rect(b * columnWidth, OVERVIEW_PLOT_H - h, columnWidth + 0.02, h);
      }
      return shape;
    };
    const maxTicks = Math.max(1, Math.floor(width / PX_PER_TICK_LABEL));
    histogram = { possible: path(possible), certain: path(certain),
      ticks: axisTicks(DOMAIN[0], DOMAIN[1], maxTicks, ERA, CALENDAR, false).majors };
  }

  function drawHistogram(ctx, width) {
    const p = canvasPainter(ctx);
    p.rect(0, 0, width, OVERVIEW_H, "#ffffff");
    p.rect(0, 0, width, OVERVIEW_PLOT_H, "#f7f7f7");
    ctx.fillStyle = "#c4cbd3";
    ctx.fill(histogram.possible);
    ctx.fillStyle = "#4d5966";
    ctx.fill(histogram.certain);
    p.line(0, OVERVIEW_PLOT_H + 0.5, width, OVERVIEW_PLOT_H + 0.5, SEPARATOR_COLOR, 1);
    for (const t of histogram.ticks) {
      const at = Math.round((t.day - DOMAIN[0]) * (width / DOMAIN_SPAN)) + 0.5;
      p.line(at, OVERVIEW_PLOT_H, at, OVERVIEW_PLOT_H + 4, MUTED_COLOR, 1);
      const w = measure(t.label, SMALL_SIZE);
      p.text(Math.min(Math.max(at, w / 2 + 1), width - w / 2 - 1), OVERVIEW_H - 5, t.label, SMALL_SIZE, null, "middle", MUTED_COLOR);
    }
  }

  function brushPixels() {
    const width = canvasSize.overviewWidth, k = width / DOMAIN_SPAN;
    return [(state.from - DOMAIN[0]) * k, (state.to - DOMAIN[0]) * k];
  }

  function drawOverview() {
    const width = canvasSize.overviewWidth;
    const ctx = sizeCanvas(ui.overview, width, OVERVIEW_H);
    drawHistogram(ctx, width);
    let [x0, x1] = brushPixels();
    x0 = Math.max(x0, 0); x1 = Math.min(x1, width);
    if (x1 - x0 < 3) { const mid = (x0 + x1) / 2; x0 = mid - 1.5; x1 = mid + 1.5; }
    // Veil the parts outside the brush, frame the brush.
    ctx.fillStyle = "rgba(255,255,255,0.6)";
    if (x0 > 0) ctx.fillRect(0, 0, x0, OVERVIEW_PLOT_H);
    if (x1 < width) ctx.fillRect(x1, 0, width - x1, OVERVIEW_PLOT_H);
    ctx.fillStyle = "rgba(26,26,26,0.06)";
    ctx.fillRect(x0, 0, x1 - x0, OVERVIEW_PLOT_H);
    ctx.strokeStyle = TEXT_COLOR;
    ctx.lineWidth = 1.5;
    ctx.strokeRect(x0 + 0.75, 0.75, Math.max(x1 - x0 - 1.5, 1), OVERVIEW_PLOT_H - 1.5);
    ctx.fillStyle = TEXT_COLOR;   // grips
    for (const at of [x0, x1]) ctx.fillRect(at - 2, OVERVIEW_PLOT_H / 2 - 7, 4, 14);
    ui.overview.setAttribute("aria-valuenow", String(Math.round((state.from + state.to) / 2)));
    ui.overview.setAttribute("aria-valuetext", rangeText(state.from, state.to));
  }

  // ==========================================================================================
  // Details: the hovered record, else the selected (focused or pinned) one, else a key.
  // ==========================================================================================

  function shownRecordForDetails() {
    if (state.pinned && state.selected >= 0) return state.selected;
    return state.hover >= 0 ? state.hover : state.selected;
  }

  let detailsShowing = "";
  function updateDetails() {
    const i = shownRecordForDetails();
    ui.details.classList.toggle("tl-pinned", state.pinned && state.selected >= 0);
    // Rebuilt only when what it says changes: the live region reads out each rebuild.
    const key = i < 0 ? "idle" : `${i}|${state.pinned && i === state.selected}|${shown[i]}`;
    if (key === detailsShowing) return;
    detailsShowing = key;
    ui.detailsBody.replaceChildren(...(i >= 0 ? recordDetails(i) : idleDetails()));
  }

  function recordDetails(i) {
    const nodes = [];
    const label = COLUMNS.label[i] || "(no label)";
    nodes.push(el("h2", { class: "tl-details-title" }, label));
    const status = state.pinned && i === state.selected ? "Pinned: Escape unpins" : "Click or Enter pins";
    nodes.push(el("p", { class: "tl-details-status" }, status));
    if (!shown[i]) nodes.push(el("p", { class: "tl-note" }, "Hidden by the filters."));
    const list = el("dl", { class: "tl-facts" });
    const fact = (name, value) => { if (value) list.append(el("dt", {}, name), el("dd", {}, value)); };
    fact("Id", idOf(i));
    fact("Group", GROUPS[groupOf[i]] ? GROUPS[groupOf[i]][0] : "");
    if (colorValueOf[i] >= 0 && COLORS[colorValueOf[i]]) fact(DATA.colorTitle || "Colour", COLORS[colorValueOf[i]][0]);
    const start = COLUMNS.start[i], end = COLUMNS.end[i];
    fact(flags[i] & F_POINT ? "Date as written" : "Start as written", start || "(empty)");
    if (!(flags[i] & F_POINT) || end) fact("End as written", end || endCellNote(i));
    nodes.push(list);
    const alongside = el("button", { type: "button", class: "tl-alongside", id: "tl-alongside" },
      GROUPS.length > 1 ? "Who else was possibly active then, in this group" : "Who else was possibly active then");
    alongside.addEventListener("click", () => showAlongside(i));
    nodes.push(alongside);
    // The static chart's tooltip, without the lines shown above (label, written, source);
    // a large chart's data leave the tooltips out, and the two main lines are made here.
    const tooltip = COLUMNS.details && COLUMNS.details[i];
    const lines = tooltip ? String(tooltip).split("\n").slice(1).filter((line) => !/^(written|source): /.test(line))
      : boundLines(i);
    if (lines.length) {
      const reading = el("ul", { class: "tl-lines" });
      for (const line of lines) reading.appendChild(el("li", {}, line));
      nodes.push(reading);
    }
    nodes.push(el("p", { class: "tl-source" }, `Source: ${sourceText(i)}`));
    const explained = [...new Set([start, end].filter(Boolean))];
    for (const text of explained) {
      const section = el("section", { class: "tl-explain" });
      section.appendChild(el("h3", {}, `How “${text}” was read`));
      const lines2 = EXPLANATIONS[text];
      const openSide = (text === start && (flags[i] & F_OPEN_START)) || (text === end && (flags[i] & F_OPEN_END));
      if (openSide) {
        // `parse --explain` reads an open end on its own as no date; here it is one.
        section.appendChild(el("p", { class: "tl-note" }, "An open end (ISO 8601-2 “..”): the span runs on beyond the chart."));
      } else if (Array.isArray(lines2) && lines2.length) {
        const pre = el("pre", {});
        pre.textContent = lines2.join("\n");
        section.appendChild(pre);
      } else {
        section.appendChild(el("p", { class: "tl-note" }, "No reading stored for this date (`timelines parse --explain` gives it)."));
      }
      nodes.push(section);
    }
    return nodes;
  }

  // "possible: … to …" and "certain: … to …" from the bounds, worded as bars.tooltip words them.
  function boundLines(i) {
    const [e0, l0, e1, l1] = boundsOf(i);
    const unknownBit = 2 ** Math.max(QUALIFIER_NAMES.indexOf("unknown"), 0);
    const far = (day, isOpen) => {
      if (day !== null && day !== undefined) return isoFromFixed(day);
      if (isOpen) return "open";
      return qualifierBits[i] & unknownBit ? "not recorded" : "no limit";
    };
    const near = (day, isOpen) => (isOpen || day === null || day === undefined ? "open" : isoFromFixed(day));
    const openStart = (flags[i] & F_OPEN_START) !== 0, openEnd = (flags[i] & F_OPEN_END) !== 0;
    const certain = flags[i] & F_CORE ? `${near(l0, openStart)} to ${near(e1, openEnd)}` : "none";
    return [`possible: ${far(e0, openStart)} to ${far(l1, openEnd)}`, `certain: ${certain}`];
  }

  function endCellNote(i) {
    // An end of null is the start's own cell; "" an empty one.
    return COLUMNS.end[i] === null ? "(as the start)" : "(empty)";
  }

  function idleDetails() {
    const nodes = [el("h2", { class: "tl-details-title" }, "Details")];
    nodes.push(el("p", {}, "Point at a record, or click it, to see its dates and how they were read."));
    const key = el("ul", { class: "tl-key" });
    for (const [sign, text] of [
      ["solid bar", "certain: the span surely covers this"],
      ["fading", "possible: the date lies somewhere in the fading part"],
      ["arrowhead", "open: runs on beyond the chart"],
      ["dashed", "not recorded: drawn short, it could lie anywhere beyond"],
      ["[ ]", "before / after: no later / no earlier than the bracket"],
      ["◆", "a dated moment, its window a thin line"],
      ["~ ? ~?", "approximate, uncertain, both"],
    ]) {
      const item = el("li", {});
      item.append(el("strong", {}, sign), document.createTextNode(` ${text}`));
      key.appendChild(item);
    }
    nodes.push(key);
    const undated = DATA.undated || [];
    if (undated.length) {
      nodes.push(el("h3", {}, `Not drawn (${fmt(undated.length)}): no date`));
      const list = el("ul", { class: "tl-undated" });
      for (const text of undated.slice(0, 200)) list.appendChild(el("li", {}, text));
      if (undated.length > 200) list.appendChild(el("li", {}, `and ${fmt(undated.length - 200)} more`));
      nodes.push(list);
    }
    return nodes;
  }

  // ==========================================================================================
  // Saving: SVG and PNG of the view (the shown records meeting its range, lanes compacted),
  // CSV of the filtered records.
  // ==========================================================================================

  const EXPORT_TITLE_H = 40, EXPORT_FOOT_H = 28, EXPORT_MARGIN = 16;

  // The lanes of the export: those holding a shown record whose extent meets the range.
  function exportRows(view) {
    const rows = [];
    let y = EXPORT_TITLE_H + AXIS_H + 4, lastGroup = -1;
    for (let l = 0; l < LANES; l++) {
      let has = false;
      for (let at = firstReaching(l, view.from), end = laneFirst[l + 1]; at < end; at++) {
        const i = laneItems[at];
        if (extentLow[i] > view.to) break;
        if (shown[i] && extentHigh[i] >= view.from) { has = true; break; }
      }
      if (!has) continue;
      if (laneGroup[l] !== lastGroup) {
        lastGroup = laneGroup[l];
        rows.push({ header: lastGroup, y });
        y += HEADER_H;
      }
      rows.push({ lane: l, y });
      y += LANE_H;
    }
    return { rows, height: y + EXPORT_FOOT_H };
  }

  function filterSummary() {
    const parts = [];
    if (state.query) parts.push(`search “${state.query}”`);
    if (state.hiddenGroups.size) parts.push(`groups hidden: ${[...state.hiddenGroups].map((g) => GROUPS[g][0]).join(", ")}`);
    if (state.hiddenColors.size) parts.push(`${DATA.colorTitle || "colours"} hidden: ${[...state.hiddenColors].map((c) => COLORS[c][0]).join(", ")}`);
    if (state.quals.size) parts.push(`only ${[...state.quals].join(" and ")}`);
    if (state.time !== "all") parts.push(`${state.time} active in the range`);
    return parts.join("; ");
  }

  function paintExport(p, view, layout) {
    const { rows, height } = layout;
    p.text(8, 26, DATA.title || "Timeline", 18, "bold", "start", TEXT_COLOR);
    const plotTop = EXPORT_TITLE_H + AXIS_H;
    drawGrid(p, view, plotTop, height - EXPORT_FOOT_H - plotTop);
    drawAxisOn(p, view, EXPORT_TITLE_H, AXIS_H);
    let first = true;
    for (const row of rows) {
      if (row.header !== undefined) { drawHeader(p, row.header, row.y, view.width, !first); first = false; }
      else drawLane(p, row.lane, row.y, view);
    }
    const filters = filterSummary();
    const foot = `${rangeText(view.from, view.to)}; ${fmt(exportCount(view))} of ${fmt(N)} records${filters ? `; ${filters}` : ""}`;
    p.text(8, height - 10, foot, SMALL_SIZE, null, "start", MUTED_COLOR);
  }

  function exportCount(view) {
    let count = 0;
    for (let i = 0; i < N; i++) if (shown[i] && extentLow[i] <= view.to && extentHigh[i] >= view.from) count++;
    return count;
  }

  function svgText() {
    const view = currentView();
    const layout = exportRows(view);
    const doc = document.implementation.createDocument(SVG_NS, "svg", null);
    const svg = doc.documentElement;
    const set = (node, attributes) => { for (const [k, v] of Object.entries(attributes)) node.setAttribute(k, String(v)); };
    const fullWidth = view.width + 2 * EXPORT_MARGIN;
    set(svg, { width: fullWidth, height: layout.height, viewBox: `0 0 ${fullWidth} ${layout.height}`,
      "font-family": FONT_FAMILY, role: "img", "aria-labelledby": "title desc" });
    const title = doc.createElementNS(SVG_NS, "title");
    title.setAttribute("id", "title");
    title.textContent = DATA.title || "Timeline";
    const desc = doc.createElementNS(SVG_NS, "desc");
    desc.setAttribute("id", "desc");
    const filters = filterSummary();
    desc.textContent = `${DATA.description || ""} This view: ${rangeText(view.from, view.to)}, `
      + `${fmt(exportCount(view))} of ${fmt(N)} records${filters ? ` (${filters})` : ""}.`;
    const defs = doc.createElementNS(SVG_NS, "defs");
    const ground = doc.createElementNS(SVG_NS, "rect");
    set(ground, { width: fullWidth, height: layout.height, fill: "#ffffff" });
    const body = doc.createElementNS(SVG_NS, "g");
    body.setAttribute("transform", `translate(${EXPORT_MARGIN} 0)`);
    svg.append(title, desc, defs, ground, body);
    paintExport(svgPainter(doc, body, defs), view, layout);
    return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(svg)}\n`;
  }

  function download(blob, name) {
    const url = URL.createObjectURL(blob);
    const a = document.createElement("a");
    a.href = url;
    a.download = name;
    a.hidden = true;
    document.body.appendChild(a);
    a.click();
    a.remove();
    setTimeout(() => URL.revokeObjectURL(url), 10000);
  }

  function savePng() {
    const view = currentView();
    const layout = exportRows(view);
    // Twice the resolution, less where a very tall view would pass the browsers' canvas limits.
    const fullWidth = view.width + 2 * EXPORT_MARGIN;
    const limit = Math.min(2, 32000 / layout.height, Math.sqrt(2.4e8 / (fullWidth * layout.height)));
    const scale = Math.max(limit, 0.05);
    const canvas = document.createElement("canvas");
    canvas.width = Math.max(1, Math.round(fullWidth * scale));
    canvas.height = Math.max(1, Math.round(layout.height * scale));
    const ctx = canvas.getContext("2d");
    ctx.fillStyle = "#ffffff";
    ctx.fillRect(0, 0, canvas.width, canvas.height);
    ctx.setTransform(scale, 0, 0, scale, EXPORT_MARGIN * scale, 0);
    paintExport(canvasPainter(ctx), view, layout);
    canvas.toBlob((blob) => { if (blob) download(blob, "timeline-view.png"); }, "image/png");
  }

  function csvField(value, isDate) {
    let text = value === null || value === undefined ? "" : String(value);
    // A leading =, +, -, @ (or tab, return) would be read as a formula by a spreadsheet.
    if (!isDate && /^[=+\-@\t\r]/.test(text)) text = `'${text}`;
    return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
  }

  function csvText() {
    const rows = [["label", "id", "group", "start", "end", "possible from", "possible to",
      "certain from", "certain to", "source"].join(",")];
    const iso = (day) => (day === null || day === undefined ? "" : isoFromFixed(day));
    for (let at = 0; at < N; at++) {
      const i = laneItems[at];
      if (!shown[i]) continue;
      const [e0, l0, e1, l1] = boundsOf(i);
      const core = flags[i] & F_CORE;
      rows.push([
        csvField(COLUMNS.label[i]), csvField(idOf(i)),
        csvField(GROUPS[groupOf[i]] ? GROUPS[groupOf[i]][0] : ""),
        csvField(COLUMNS.start[i]), csvField(endText(i)),
        csvField(iso(e0), true), csvField(iso(l1), true),
        csvField(core ? iso(l0) : "", true), csvField(core ? iso(e1) : "", true),
        csvField(sourceText(i)),
      ].join(","));
    }
    return `${rows.join("\r\n")}\r\n`;
  }

  // ==========================================================================================
  // Controls: toolbar, legend, overview brush, main view pointer and wheel.
  // ==========================================================================================

  function zoomAround(day, factor) {
    const span = state.to - state.from;
    const next = Math.min(Math.max(span * factor, MIN_SPAN), MAX_SPAN);
    const from = day - (day - state.from) * (next / span);
    setRange(from, from + next);
  }

  const zoomCentre = (factor) => zoomAround((state.from + state.to) / 2, factor);
  const pan = (share) => { const shift = (state.to - state.from) * share; setRange(state.from + shift, state.to + shift); };

  // The records of i's group possibly active while i possibly was: the view set to i's
  // possible extent, the time filter to "possibly", the other groups hidden.
  function showAlongside(i) {
    const low = Number.isFinite(possibleLow(i)) ? possibleLow(i) : DOMAIN[0];
    const high = Number.isFinite(possibleHigh(i)) ? possibleHigh(i) : DOMAIN[1];
    state.hiddenGroups = new Set(GROUPS.map((_, g) => g).filter((g) => g !== groupOf[i]));
    state.time = "possibly";
    setRange(low, Math.max(high, low + MIN_SPAN));
    syncControls();
    filtersChanged();
    invalidate("time");
  }

  function filtersChanged() {
    invalidate("filters", "hash", "details");
  }

  function syncControls() {
    ui.search.value = state.query;
    ui.time.value = state.time;
    for (const name of QUALIFIER_NAMES) ui.quals[name].checked = state.quals.has(name);
    ui.qualSummary.textContent = state.quals.size ? `Only records that are… (${state.quals.size})` : "Only records that are…";
    ui.groupToggles.forEach((b, g) => setPressed(b, !state.hiddenGroups.has(g)));
    ui.colorToggles.forEach((b, c) => setPressed(b, !state.hiddenColors.has(c)));
  }

  function setPressed(button, on) {
    button.setAttribute("aria-pressed", on ? "true" : "false");
    button.classList.toggle("tl-off", !on);
  }

  function bindToolbar() {
    ui.search.addEventListener("input", () => { state.query = ui.search.value; filtersChanged(); });
    ui.time.addEventListener("change", () => { state.time = ui.time.value; invalidate("time", "hash"); });
    for (const name of QUALIFIER_NAMES) {
      ui.quals[name].addEventListener("change", () => {
        if (ui.quals[name].checked) state.quals.add(name); else state.quals.delete(name);
        syncControls();
        filtersChanged();
      });
    }
    ui.zoomIn.addEventListener("click", () => zoomCentre(0.5));
    ui.zoomOut.addEventListener("click", () => zoomCentre(2));
    ui.reset.addEventListener("click", () => setRange(DOMAIN[0], DOMAIN[1]));
    ui.saveSvg.addEventListener("click", () => download(new Blob([svgText()], { type: "image/svg+xml" }), "timeline-view.svg"));
    ui.savePng.addEventListener("click", savePng);
    ui.saveCsv.addEventListener("click", () => download(new Blob([csvText()], { type: "text/csv;charset=utf-8" }), "timeline-records.csv"));
    const toggle = (set, index) => { if (set.has(index)) set.delete(index); else set.add(index); syncControls(); filtersChanged(); };
    ui.groupToggles.forEach((b, g) => b.addEventListener("click", () => toggle(state.hiddenGroups, g)));
    ui.colorToggles.forEach((b, c) => b.addEventListener("click", () => toggle(state.hiddenColors, c)));
  }

  // What a press at x (px) on the overview grabs: an edge of the brush (resize), its inside
  // (move), or the ground (draw a new range). A brush over nearly the whole strip leaves no
  // ground to draw on, so there a drag draws.
  function brushPart(x, width) {
    const [x0, x1] = brushPixels();
    const full = Math.min(x1, width) - Math.max(x0, 0) >= width * 0.95;
    if (Math.abs(x - x0) <= 5 && !full) return "left";
    if (Math.abs(x - x1) <= 5 && !full) return "right";
    if (x > x0 && x < x1 && !full) return "move";
    return "draw";
  }

  function bindOverview() {
    const canvas = ui.overview;
    let drag = null;
    const dayAt = (event) => {
      const box = canvas.getBoundingClientRect();
      return DOMAIN[0] + ((event.clientX - box.left) / Math.max(box.width, 1)) * DOMAIN_SPAN;
    };
    canvas.addEventListener("pointerdown", (event) => {
      if (event.button !== 0) return;
      canvas.setPointerCapture(event.pointerId);
      const box = canvas.getBoundingClientRect();
      const x = event.clientX - box.left;
      const day = dayAt(event);
      const part = brushPart(x, box.width);
      drag = { mode: part, startX: x, moved: false, anchor: day, grab: day - state.from, span: state.to - state.from };
      // Resizing holds the far edge still.
      if (part === "left") drag.anchor = state.to;
      if (part === "right") drag.anchor = state.from;
      event.preventDefault();
      canvas.focus({ preventScroll: true });
    });
    canvas.addEventListener("pointermove", (event) => {
      if (!drag) {
        const box = canvas.getBoundingClientRect();
        const part = brushPart(event.clientX - box.left, box.width);
        canvas.classList.toggle("tl-over-brush", part === "move");
        canvas.classList.toggle("tl-over-edge", part === "left" || part === "right");
        return;
      }
      const box = canvas.getBoundingClientRect();
      if (Math.abs(event.clientX - box.left - drag.startX) > 2) drag.moved = true;
      if (!drag.moved) return;
      const day = dayAt(event);
      if (drag.mode === "move") setRange(day - drag.grab, day - drag.grab + drag.span);
      else setRange(Math.min(drag.anchor, day), Math.max(drag.anchor, day));   // draw or resize
    });
    const end = (event) => {
      if (!drag) return;
      // A click off the brush centres the view there.
      if (!drag.moved && drag.mode === "draw") {
        const span = state.to - state.from, day = dayAt(event);
        setRange(day - span / 2, day + span / 2);
      }
      drag = null;
    };
    canvas.addEventListener("pointerup", end);
    canvas.addEventListener("pointercancel", () => { drag = null; });
    canvas.addEventListener("keydown", (event) => {
      const step = event.shiftKey ? 0.5 : 0.1;
      const actions = {
        ArrowLeft: () => pan(-step), ArrowRight: () => pan(step),
        ArrowDown: () => pan(-step), ArrowUp: () => pan(step),
        PageUp: () => pan(1), PageDown: () => pan(-1),
        Home: () => { const s = state.to - state.from; setRange(DOMAIN[0], DOMAIN[0] + s); },
        End: () => { const s = state.to - state.from; setRange(DOMAIN[1] - s, DOMAIN[1]); },
        "+": () => zoomCentre(0.5), "=": () => zoomCentre(0.5), "-": () => zoomCentre(2), _: () => zoomCentre(2),
      };
      const action = actions[event.key];
      if (action && !event.ctrlKey && !event.metaKey && !event.altKey) { event.preventDefault(); action(); }
    });
  }

  // The record under a point of the lanes canvas (px), or -1.
  function recordAt(x, y) {
    const contentY = y + ui.main.scrollTop;
    const row = rowAt(contentY);
    if (row >= rowLanes.length) return -1;
    const lane = rowLanes[row];
    if (contentY < laneTop[lane]) return -1;            // a header row
    const view = currentView();
    const day = view.from + x / view.k, tolerance = 4 / view.k;
    let best = -1, bestDistance = Infinity;
    for (let at = firstReaching(lane, day - tolerance - 30 / view.k), end = laneFirst[lane + 1]; at < end; at++) {
      const i = laneItems[at];
      if (extentLow[i] > day + tolerance + 30 / view.k) break;
      if (!shown[i]) continue;
      const [left, right] = markBox(i, view);
      const distance = x < left ? left - x : x > right ? x - right : 0;
      if (distance <= 4 && distance < bestDistance) { best = i; bestDistance = distance; }
    }
    return best;
  }

  function bindMain() {
    const canvas = ui.lanes, main = ui.main;
    let drag = null;
    const local = (event) => { const box = canvas.getBoundingClientRect(); return [event.clientX - box.left, event.clientY - box.top]; };
    canvas.addEventListener("pointerdown", (event) => {
      if (event.button !== 0) return;
      main.focus({ preventScroll: true });
      canvas.setPointerCapture(event.pointerId);
      drag = { x: event.clientX, y: event.clientY, from: state.from, to: state.to, scroll: main.scrollTop, moved: false };
      canvas.classList.add("tl-dragging");
    });
    canvas.addEventListener("pointermove", (event) => {
      if (drag) {
        const dx = event.clientX - drag.x, dy = event.clientY - drag.y;
        if (!drag.moved && Math.hypot(dx, dy) > 3) drag.moved = true;
        if (!drag.moved) return;
        const shift = -dx * ((drag.to - drag.from) / canvasSize.width);
        setRange(drag.from + shift, drag.to + shift);
        main.scrollTop = drag.scroll - dy;
        return;
      }
      const [x, y] = local(event);
      setHover(recordAt(x, y));
    });
    const finish = (event) => {
      if (!drag) return;
      const moved = drag.moved;
      drag = null;
      canvas.classList.remove("tl-dragging");
      if (moved) return;
      const [x, y] = local(event);
      const i = recordAt(x, y);
      if (i >= 0) select(i, true, false);
      else if (state.pinned) unpin();
    };
    canvas.addEventListener("pointerup", finish);
    canvas.addEventListener("pointercancel", () => { drag = null; canvas.classList.remove("tl-dragging"); });
    canvas.addEventListener("pointerleave", () => { if (!drag) setHover(-1); });
    canvas.addEventListener("dblclick", (event) => {
      const [x] = local(event);
      zoomAround(state.from + x / currentView().k, event.shiftKey ? 2 : 0.5);
    });
    main.addEventListener("wheel", onWheel, { passive: false });
    main.addEventListener("scroll", () => invalidate("main", "hash"));
    main.addEventListener("keydown", onMainKey);
    new ResizeObserver(() => {
      const overview = ui.overview.parentNode.clientWidth;
      if (main.clientWidth === canvasSize.width && main.clientHeight - AXIS_H === canvasSize.lanesHeight
        && overview === canvasSize.overviewWidth) return;    // the first call, at start
      layoutMain();
      invalidate("axis", "main", "brush", "histogram");
    }).observe(main);
  }

  function onWheel(event) {
    const lineScale = event.deltaMode === 1 ? 16 : event.deltaMode === 2 ? canvasSize.lanesHeight : 1;
    const dx = event.deltaX * lineScale, dy = event.deltaY * lineScale;
    const horizontal = event.shiftKey || Math.abs(dx) > Math.abs(dy);
    if (!horizontal && !event.ctrlKey && !event.metaKey && !WHEEL_ZOOMS_WITHOUT_CTRL) return;
    event.preventDefault();
    const k = canvasSize.width / (state.to - state.from);
    if (horizontal) {
      const shift = (Math.abs(dx) > Math.abs(dy) ? dx : dy) / k;
      setRange(state.from + shift, state.to + shift);
      return;
    }
    const box = ui.lanes.getBoundingClientRect();
    const day = state.from + (event.clientX - box.left) / k;
    const factor = Math.min(Math.max(Math.exp(dy * 0.0015), 0.5), 2);
    zoomAround(day, factor);
  }

  function setHover(i) {
    if (i === state.hover) return;
    state.hover = i;
    ui.lanes.classList.toggle("tl-over-record", i >= 0);
    invalidate("main", "details");
  }

  function select(i, pin, reveal) {
    state.selected = i;
    state.pinned = pin;
    if (reveal) {
      // Moved to by the keyboard: the details follow it, not a pointer resting elsewhere.
      state.hover = -1;
      revealRecord(i);
    }
    updateDetails();      // at once: a screen reader hears the record as the key is pressed
    invalidate("main", "hash");
  }

  function unpin() {
    state.pinned = false;
    updateDetails();
    invalidate("main", "hash");
  }

  // Scrolls a record's lane into view, and pans to it when none of it shows.
  function revealRecord(i) {
    const top = laneTop[laneOf[i]];
    if (top >= 0) {
      const height = canvasSize.lanesHeight, scroll = ui.main.scrollTop;
      if (top < scroll + 24) ui.main.scrollTop = Math.max(top - LANE_H - 24, 0);
      else if (top + LANE_H > scroll + height) ui.main.scrollTop = top + 2 * LANE_H - height;
    }
    const low = extentLow[i], high = extentHigh[i];
    if (high < state.from || low > state.to) {
      const span = state.to - state.from;
      const anchor = Number.isFinite(low) ? low : high;
      setRange(anchor - span * 0.2, anchor + span * 0.8);
    }
  }

  // ==========================================================================================
  // Keyboard
  // ==========================================================================================

  // The next shown record after (step 1) or before (step -1) a position in lane order.
  function stepRecord(from, step) {
    for (let at = from + step; at >= 0 && at < N; at += step) {
      const i = laneItems[at];
      if (shown[i] && laneTop[laneOf[i]] >= 0) return i;
    }
    return -1;
  }

  function moveFocus(step) {
    let i;
    if (state.selected >= 0) i = stepRecord(orderOf[state.selected], step);
    else {
      // Nothing focused yet: the first record from the top of the viewport (or the last
      // above its bottom).
      const row = rowAt(ui.main.scrollTop + (step > 0 ? 0 : canvasSize.lanesHeight));
      const lane = rowLanes[Math.min(row, rowLanes.length - 1)];
      if (lane === undefined) return;
      i = step > 0 ? stepRecord(laneFirst[lane] - 1, 1) : stepRecord(laneFirst[lane + 1], -1);
    }
    if (i >= 0) select(i, state.pinned, true);
  }

  function onMainKey(event) {
    if (event.ctrlKey || event.metaKey || event.altKey) return;
    const actions = {
      "+": () => zoomCentre(0.5), "=": () => zoomCentre(0.5),
      "-": () => zoomCentre(2), _: () => zoomCentre(2),
      ArrowLeft: () => pan(event.shiftKey ? -0.5 : -0.125),
      ArrowRight: () => pan(event.shiftKey ? 0.5 : 0.125),
      ArrowDown: () => moveFocus(1),
      ArrowUp: () => moveFocus(-1),
      Home: () => { const i = stepRecord(-1, 1); if (i >= 0) select(i, state.pinned, true); },
      End: () => { const i = stepRecord(N, -1); if (i >= 0) select(i, state.pinned, true); },
      Enter: () => { if (state.selected >= 0) select(state.selected, true, true); },
      Escape: () => { if (state.pinned) unpin(); else if (state.selected >= 0) select(-1, false, false); },
    };
    const action = actions[event.key];
    if (action) { event.preventDefault(); action(); }
  }

  function bindGlobalKeys() {
    document.addEventListener("keydown", (event) => {
      const target = event.target;
      const typing = (target instanceof HTMLInputElement && !["checkbox", "radio", "button"].includes(target.type))
        || target instanceof HTMLSelectElement || target instanceof HTMLTextAreaElement;
      if (event.key === "/" && !typing && !event.ctrlKey && !event.metaKey && !event.altKey) {
        event.preventDefault();
        ui.search.focus();
        ui.search.select();
      } else if (event.key === "Escape" && state.pinned && target !== ui.main && !typing) {
        unpin();
      }
    });
    window.addEventListener("hashchange", () => {
      readHash();
      syncControls();
      filtersChanged();
      invalidate("axis", "main", "brush", "time");
    });
  }

  // ==========================================================================================
  // Start
  // ==========================================================================================

  function start() {
    readColumns();
    buildLanes();
    buildPage();
    readHash();
    syncControls();
    bindToolbar();
    bindOverview();
    bindMain();
    bindGlobalKeys();
    // The first frame is drawn at once, not on the next animation frame.
    // (flush lays the main view out once the rows are known.)
    dirty.add("filters").add("axis").add("main").add("brush").add("count").add("details").add("histogram");
    flush();
    api.ready = true;
    document.body.dataset.ready = "1";
  }

  Object.assign(api, {
    ticks(startDay, endDay, maxTicks = 8, era = "bce", calendar = "gregorian", reform = null) {
      if (!(endDay > startDay)) throw new RangeError("the end must be after the start");
      const cal = makeCalendar(calendar, reform === null || reform === undefined ? undefined : Number(reform));
      return axisTicks(Number(startDay), Number(endDay), maxTicks, era, cal, false).majors
        .map((t) => ({ day: t.day, label: t.label }));
    },
    state() {
      // Work waiting for the next frame is done first, so the answer is the current state.
      if (frame) { cancelAnimationFrame(frame); flush(); }
      const maxTicks = Math.max(1, Math.floor(canvasSize.width / PX_PER_TICK_LABEL));
      return {
        ticks: viewTicks(state.from, state.to, canvasSize.width).majors.map((t) => t.label), maxTicks,
        from: state.from, to: state.to, shown: shownCount, total: N, selected: state.selected,
        pinned: state.pinned, hiddenGroups: [...state.hiddenGroups].sort((a, b) => a - b),
        hiddenColors: [...state.hiddenColors].sort((a, b) => a - b), query: state.query,
        quals: QUALIFIER_NAMES.filter((q) => state.quals.has(q)), time: state.time,
      };
    },
    svgText,
    csvText,
    isoFromFixed,
  });
  window.timelinesExplorer = api;

  start();
  }
})();
