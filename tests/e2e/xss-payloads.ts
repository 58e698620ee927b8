/**
 * Markup that tries to run script when user-written text is shown as HTML. Each payload that runs
 * sets `window.__xss = 1` or opens a dialog, so a browser test can tell that none ran.
 * Shared by every test that saves free text (sheet prose, ratings, footnotes).
 */
export const xssPayloads: readonly string[] = [
  "<script>window.__xss = 1</script>",
  "<SCRIPT>window.__xss = 1</SCRIPT>",
  "<ScRiPt>alert('xss')</sCrIpT>",
  '<script src="data:text/javascript,window.__xss=1"></script>',
  "<img src=x onerror=\"window.__xss = 1\">",
  "<IMG SRC=x ONERROR=alert('xss')>",
  '<svg onload="window.__xss = 1"></svg>',
  "<svg><script>window.__xss = 1</script></svg>",
  "<body onload=window.__xss=1>",
  '<iframe srcdoc="<script>parent.__xss = 1</script>"></iframe>',
  '<iframe src="javascript:parent.__xss=1"></iframe>',
  '<a href="javascript:window.__xss=1">click me (html)</a>',
  "[click me (markdown)](javascript:window.__xss=1)",
  "[entity link](&#106;&#97;&#118;&#97;&#115;&#99;&#114;&#105;&#112;&#116;&#58;window.__xss=1)",
  "[hex entity link](&#x6A;avascript:window.__xss=1)",
  "[tab in scheme](java\tscript:window.__xss=1)",
  "[upper-case scheme](JAVASCRIPT:window.__xss=1)",
  "[data url](data:text/html;base64,PHNjcmlwdD53aW5kb3cuX194c3M9MTwvc2NyaXB0Pg==)",
  '<a href="data:text/html,<script>window.__xss=1</script>">data link</a>',
  "![image](javascript:window.__xss=1)",
  '<div style="background:url(javascript:window.__xss=1)">style url</div>',
  '<div style="width: expression(window.__xss=1)">style expression</div>',
  "<style>@import 'javascript:window.__xss=1';</style>",
  '<object data="javascript:window.__xss=1"></object>',
  '<embed src="javascript:window.__xss=1">',
  '<details open ontoggle="window.__xss=1">',
  '<input autofocus onfocus="window.__xss=1">',
  '<math><mtext><table><mglyph><style><img src=x onerror="window.__xss=1">',
  '<form action="javascript:window.__xss=1"><button>go</button></form>',
  '<meta http-equiv="refresh" content="0;url=javascript:window.__xss=1">',
  "\"><script>window.__xss = 1</script>",
  "`<script>window.__xss = 1</script>` in code stays text",
];
