#include "post/html_report.hpp"

#include <cstdlib>

#include <fmt/format.h>

#include "post/atomic_file.hpp"
#include "post/summary.hpp"
#include "post/svg_plot.hpp"

namespace tf::post {
namespace {

// Embedded, so the page needs nothing from the network; DejaVu is what Debian installs by default.
constexpr const char* kStyle = R"(
body{font-family:'DejaVu Sans',Verdana,Arial,sans-serif;color:#222;background:#f6f7f9;margin:0}
main{max-width:1000px;margin:0 auto;padding:24px 32px 48px;background:#fff}
h1{font-size:24px;margin:8px 0 4px} h2{font-size:18px;margin:28px 0 8px;border-bottom:1px solid #ddd;padding-bottom:4px}
.subtitle{color:#555;margin:0 0 16px}
.warnings{border:2px solid #b26a00;background:#fff4e0;color:#4a2c00;padding:8px 14px 8px 30px;border-radius:4px}
.caution{border:2px solid #b3261e;background:#fdecea;color:#5f1410;padding:10px 14px;border-radius:4px;font-weight:bold}
table{border-collapse:collapse;font-size:13px;margin:4px 0 8px}
th,td{border:1px solid #d8dbe0;padding:4px 8px;text-align:left;vertical-align:top;overflow-wrap:break-word}
th{background:#eef1f5} td.num{text-align:right;font-variant-numeric:tabular-nums}
.note{color:#555;font-size:13px;max-width:900px}
.scroll{overflow-x:auto;max-width:100%}
figure{margin:16px 0 24px} figcaption{font-size:13px;color:#444;margin-top:4px;max-width:900px}
figure svg{max-width:100%;height:auto;border:1px solid #e4e4e4}
)";

bool looks_numeric(const std::string& s) {
  if (s.empty()) return false;
  char* end = nullptr;
  std::strtod(s.c_str(), &end);
  return end != nullptr && *end == '\0';
}

std::string render_section(const Section& s) {
  std::string out = fmt::format("<section>\n<h2>{}</h2>\n<table>\n<tr><th>quantity</th><th>value</th><th>unit</th></tr>\n",
                                html_escape(s.heading));
  for (const KeyValue& r : s.rows)
    out += fmt::format("<tr><td>{}</td><td class=\"{}\">{}</td><td>{}</td></tr>\n", html_escape(r.key),
                       looks_numeric(r.value) ? "num" : "text", html_escape(r.value), html_escape(r.unit));
  out += "</table>\n";
  if (!s.note.empty()) out += fmt::format("<p class=\"note\">{}</p>\n", html_escape(s.note));
  return out + "</section>\n";
}

std::string render_table(const Table& t) {
  // A wide table (a sweep with many metrics) scrolls sideways inside the page instead of spilling out.
  std::string out = fmt::format("<section>\n<h2>{}</h2>\n<div class=\"scroll\"><table>\n<tr>", html_escape(t.heading));
  for (const auto& c : t.columns) out += "<th>" + html_escape(c) + "</th>";
  out += "</tr>\n";
  for (const auto& row : t.rows) {
    out += "<tr>";
    for (const Cell& c : row) {
      const std::string text = html_escape(c.text);
      out += fmt::format("<td class=\"{}\">{}</td>", looks_numeric(c.text) ? "num" : "text",
                         c.link.empty() ? text : fmt::format("<a href=\"{}\">{}</a>", html_escape(c.link), text));
    }
    out += "</tr>\n";
  }
  out += "</table></div>\n";
  if (!t.note.empty()) out += fmt::format("<p class=\"note\">{}</p>\n", html_escape(t.note));
  return out + "</section>\n";
}

}  // namespace

std::string html_escape(const std::string& text) { return svg::escape(text); }

std::string render_html(const Page& page) {
  std::string out = fmt::format(
      "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n"
      "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n<title>{0}</title>\n"
      "<style>{1}</style>\n</head>\n<body>\n<main>\n<h1>{0}</h1>\n",
      html_escape(page.title), kStyle);
  if (!page.subtitle.empty()) out += fmt::format("<p class=\"subtitle\">{}</p>\n", html_escape(page.subtitle));
  out += fmt::format("<p class=\"caution\" id=\"caution\">{}</p>\n", html_escape(kSafetyCaution));
  if (!page.warnings.empty()) {
    out += "<ul class=\"warnings\" id=\"warnings\">\n";
    for (const std::string& w : page.warnings) out += "<li>warning: " + html_escape(w) + "</li>\n";
    out += "</ul>\n";
  }
  for (const Section& s : page.sections) out += render_section(s);
  for (const Table& t : page.tables) out += render_table(t);
  if (!page.figures.empty()) out += "<h2>Figures</h2>\n";
  for (const Figure& f : page.figures)
    out += fmt::format("<figure id=\"fig-{0}\" data-name=\"{0}\">\n{1}<figcaption>{2} (<a href=\"figures/{0}.svg\">"
                       "figures/{0}.svg</a>)</figcaption>\n</figure>\n",
                       html_escape(f.name), f.svg, html_escape(f.caption));
  for (const Section& s : page.appendix) out += render_section(s);
  return out + "</main>\n</body>\n</html>\n";
}

void write_report(const std::filesystem::path& dir, const Page& page) {
  std::error_code ec;
  std::filesystem::create_directories(dir / "figures", ec);
  if (ec) throw OutputError("could not create " + (dir / "figures").string() + ": " + ec.message());
  for (const Figure& f : page.figures)
    write_atomically(dir / "figures" / (f.name + ".svg"), [&](std::ostream& out) {
      out << "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" << f.svg;
    });
  // The page last: its presence means its figures are there too.
  write_atomically(dir / "report.html", [&](std::ostream& out) { out << render_html(page); });
}

}  // namespace tf::post
