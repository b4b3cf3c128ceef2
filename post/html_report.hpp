#pragma once
// A report page a reviewer opens in any browser: title, the safety caution, sections of
// key/value rows, tables and figures (inline SVG). One self-contained HTML file, no scripts, no
// external fonts or style sheets; each figure also written on its own as figures/<name>.svg.

#include <filesystem>
#include <string>
#include <vector>

namespace tf::post {

/// One row of a key/value section: a quantity, its value as text, and its unit (empty if none).
struct KeyValue {
  std::string key, value, unit;
};

struct Section {
  std::string heading;
  std::vector<KeyValue> rows;
  std::string note;  ///< a sentence under the rows (method, definitions); may be empty
};

/// A table cell; with a link the text links to it (a relative path).
struct Cell {
  std::string text, link;
  Cell(std::string t = {}, std::string l = {}) : text(std::move(t)), link(std::move(l)) {}
  Cell(const char* t) : text(t) {}
};

struct Table {
  std::string heading;
  std::vector<std::string> columns;
  std::vector<std::vector<Cell>> rows;
  std::string note;
};

struct Figure {
  std::string name;  ///< file name stem: letters, digits, '_' and '-'
  std::string caption;
  std::string svg;   ///< a complete <svg> element
};

struct Page {
  std::string title;
  std::string subtitle;  ///< e.g. the study kind and model; may be empty
  std::vector<std::string> warnings;  ///< shown under the caution, before any section (the run's warnings)
  std::vector<Section> sections;
  std::vector<Table> tables;
  std::vector<Figure> figures;
  std::vector<Section> appendix;  ///< after the figures (e.g. the inputs echoed)
};

/// The page as one HTML document; every page carries post::kSafetyCaution at its top.
std::string render_html(const Page& page);

/// Writes dir/report.html and dir/figures/<name>.svg, each atomically. Throws OutputError.
void write_report(const std::filesystem::path& dir, const Page& page);

/// Text escaped for HTML content and attribute values.
std::string html_escape(const std::string& text);

}  // namespace tf::post
