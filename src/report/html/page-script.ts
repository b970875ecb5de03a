// The report page's only script, hand-written plain JavaScript: filters, sorting, pages and row expanding.
// The page is complete without it; it reads the data-* attributes of the rows and never the network.

/** The script's text; it contains no `</script>` and needs no data besides the page's own markup. */
export const PAGE_SCRIPT = String.raw`
(function () {
  'use strict';
  try {
    setUp();
  } catch (error) {
    // Without a working script the rows must not stay hidden: show the page as it is without JavaScript.
    document.documentElement.classList.remove('js');
    throw error;
  }

  function setUp() {
    var table = document.getElementById('findings-table');
    var controls = document.getElementById('controls');
    var pager = document.getElementById('pager');
    var status = document.getElementById('status');
    if (!table || !controls || !pager || !status) return;
    var byId = function (id) { return document.getElementById(id); };
    var inputs = {
      rule: byId('filter-rule'), level: byId('filter-level'), file: byId('filter-file'),
      allowed: byId('filter-allowed'), baseline: byId('filter-baseline'), text: byId('filter-text'),
      sort: byId('sort'), pageSize: byId('page-size')
    };
    var previous = byId('page-previous');
    var next = byId('page-next');
    var pageLabel = byId('page-label');
    var items = Array.prototype.map.call(table.tBodies, function (body) {
      var data = body.dataset;
      return {
        body: body, rule: data.rule, level: data.level, severity: Number(data.severity), file: data.file,
        focus: data.focus.toLowerCase(), allowed: data.allowed, baseline: data.baseline,
        order: Number(data.order), text: data.text
      };
    });
    var compareText = function (a, b) { return a < b ? -1 : a > b ? 1 : 0; };
    var comparators = {
      location: function (a, b) { return a.order - b.order; },
      rule: function (a, b) { return compareText(a.rule, b.rule) || a.order - b.order; },
      level: function (a, b) { return a.severity - b.severity || a.order - b.order; },
      focus: function (a, b) { return compareText(a.focus, b.focus) || a.order - b.order; }
    };
    var sortedBy = 'location';
    var page = 0;
    var shown = [];

    function sortItems() {
      var key = inputs.sort.value;
      if (key === sortedBy || !comparators[key]) return;
      sortedBy = key;
      items.sort(comparators[key]);
    }

    function matches(item, words) {
      if (inputs.rule.value && item.rule !== inputs.rule.value) return false;
      if (inputs.level.value && item.level !== inputs.level.value) return false;
      if (inputs.file.value && item.file !== inputs.file.value) return false;
      if (inputs.allowed.value && item.allowed !== inputs.allowed.value) return false;
      if (inputs.baseline && inputs.baseline.value && item.baseline !== inputs.baseline.value) return false;
      for (var index = 0; index < words.length; index++) {
        if (item.text.indexOf(words[index]) < 0) return false;
      }
      return true;
    }

    function apply(fromFirstPage) {
      sortItems();
      var words = inputs.text.value.toLowerCase().split(/\s+/).filter(Boolean);
      var matching = items.filter(function (item) { return matches(item, words); });
      var size = inputs.pageSize.value === 'all' ? Math.max(1, matching.length) : Number(inputs.pageSize.value);
      var pages = Math.max(1, Math.ceil(matching.length / size));
      if (fromFirstPage) page = 0;
      if (page > pages - 1) page = pages - 1;
      var onPage = matching.slice(page * size, page * size + size);
      shown.forEach(function (item) { item.body.classList.remove('on'); });
      // Hidden rows stay where they are; only the rows of the page are moved, into the sorted order.
      onPage.forEach(function (item) {
        item.body.classList.add('on');
        table.appendChild(item.body);
      });
      shown = onPage;
      status.textContent = matching.length === 0
        ? 'No finding matches the filters (' + items.length + ' in the report).'
        : 'Showing ' + (page * size + 1) + '\u2013' + (page * size + onPage.length) + ' of ' + matching.length +
          ' matching findings (' + items.length + ' in the report).';
      pageLabel.textContent = 'Page ' + (page + 1) + ' of ' + pages;
      previous.disabled = page === 0;
      next.disabled = page >= pages - 1;
    }

    controls.addEventListener('submit', function (event) { event.preventDefault(); });
    var typing = 0;
    inputs.text.addEventListener('input', function () {
      clearTimeout(typing);
      typing = setTimeout(function () { apply(true); }, 150);
    });
    ['rule', 'level', 'file', 'allowed', 'baseline', 'sort', 'pageSize'].forEach(function (name) {
      if (inputs[name]) inputs[name].addEventListener('change', function () { apply(true); });
    });
    previous.addEventListener('click', function () { page -= 1; apply(false); table.scrollIntoView(); });
    next.addEventListener('click', function () { page += 1; apply(false); table.scrollIntoView(); });

    // A click on a row's summary opens or closes its details, unless the reader is selecting text.
    table.addEventListener('click', function (event) {
      var row = event.target.closest('tr.summary-row');
      if (!row) return;
      var selection = window.getSelection();
      if (selection && selection.toString() !== '') return;
      var details = row.parentNode.querySelector('details');
      if (details) details.open = !details.open;
    });

    // A diagram is drawn when its row is first expanded: its markup waits as the text of a <noscript>.
    table.addEventListener('toggle', function (event) {
      var details = event.target;
      if (!details.open) return;
      var waiting = details.querySelector('.diagram-box > noscript');
      if (waiting) waiting.parentNode.innerHTML = waiting.textContent;
    }, true);

    // Printing shows the rows of the current page with their details open, then puts them back.
    var openedForPrint = [];
    window.addEventListener('beforeprint', function () {
      openedForPrint = shown.map(function (item) { return item.body.querySelector('details'); })
        .filter(function (details) { return details && !details.open; });
      openedForPrint.forEach(function (details) { details.open = true; });
    });
    window.addEventListener('afterprint', function () {
      openedForPrint.forEach(function (details) { details.open = false; });
      openedForPrint = [];
    });

    controls.hidden = false;
    pager.hidden = false;
    apply(true);
  }
})();
`;
