#pragma once
// Typed reading of the tables of a parsed case file, with error messages that name the file,
// the line, the table and key, the value found and what was expected:
//
//   cases/demo.toml:14: [stator.slot] width = 0.012: out of range; expected a number in m, > 0 and <= 5
//
// Every table is opened with the full list of keys it may hold, so a misspelt key is reported as
// unknown (with the nearest valid key suggested) before the reader asks for the key it replaced.

#include <cstddef>
#include <limits>
#include <memory>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <toml++/toml.h>

#include "input/input_error.hpp"

namespace tf::input {

/// The problems found while a whole case file is read, so that one pass reports them all (up to
/// kMostListed) instead of one per run. One problem per line: a key whose value is wrong once is
/// not blamed again by the checks that read its stand-in.
class ErrorLog {
 public:
  static constexpr std::size_t kMostListed = 20;
  void note(const InputError& e);
  bool empty() const { return entries_.empty(); }
  std::size_t size() const { return entries_.size(); }
  /// Throws one InputError listing them in line order (a single problem's message unchanged).
  [[noreturn]] void raise(const std::string& path) const;

 private:
  struct Entry {
    int line;
    std::string message;
  };
  std::vector<Entry> entries_;
};

/// Thrown, only while a document collects its errors, for a problem that follows from one already
/// noted (a key missed in a table that holds a misspelling of it; a key read after the table's choice
/// had to be stood in for). Whoever reads a part of the case stops there without a word.
struct Unreported {};

/// A parsed case file: the path exactly as the user gave it, and the tree, which keeps line numbers.
/// With `errors`, the Fields of the document note a wrong value there and go on with a stand-in
/// value in its range (or the key's default) instead of throwing.
struct Document {
  std::string path;
  toml::table root;
  std::shared_ptr<ErrorLog> errors = {};
};

/// The text of a file the user named; `kind` ("case file", "sweep file") words the messages.
/// Throws InputError when the path is empty, a folder or unreadable.
std::string read_input_file(const std::string& path, std::string_view kind);

/// Parses TOML text; `path` names it in messages. Throws InputError "<path>:<line>: not valid TOML".
Document parse_document(const std::string& path, const std::string& text);

/// The line of a parsed node; 1 for nodes made in memory.
int line_of(const toml::node& node);

/// Bounds of a real value. The unit only decorates messages.
struct RealRange {
  double min = -std::numeric_limits<double>::infinity();
  double max = std::numeric_limits<double>::infinity();
  bool min_excluded = false;  ///< the value must be > min rather than >= min
  bool max_excluded = false;  ///< the value must be < max rather than <= max
  std::string_view unit = {};
  /// A part to be meshed: a value other than 0 must be at least this large (kSmallestPart for
  /// lengths [m], kSmallestArc for arcs [degrees]); 0: no such limit.
  double smallest = 0.0;
};

/// The smallest length [m] and arc [degrees] of a part turnfield meshes. Below them the mesher
/// cannot place elements reliably (nanometre parts made Gmsh fail or abort); 0.05 mm is also the
/// smallest air gap the checks allow, and a 0.1 degree arc spans about 0.05 mm at a 30 mm radius.
inline constexpr double kSmallestPart = 0.05e-3;
inline constexpr double kSmallestArc = 0.1;

/// Bounds of an integer value, both included.
/// The largest count a case file may give where its key sets no smaller limit: far beyond any real
/// machine, and small enough that sums over a winding's coil sides cannot overflow.
inline constexpr long long kMaxCount = 1'000'000;

struct IntRange {
  long long min = -kMaxCount;
  long long max = kMaxCount;
};

/// What a value in range looks like, for messages: "a number in m, > 0 and <= 5".
std::string describe(const RealRange& range);
/// "an integer from 3 to 2000", "an integer >= 1".
std::string describe(const IntRange& range);

/// The value of an integer or floating-point node; nothing for any other type.
std::optional<double> number_value(const toml::node& node);
/// Whether v lies within the range's bounds (finiteness is the caller's check).
bool within(double v, const RealRange& range);

/// Levenshtein distance: the fewest single-character insertions, deletions and substitutions.
std::size_t edit_distance(std::string_view a, std::string_view b);

/// The candidate a misspelt `word` most likely meant, or "" when none is close enough to guess.
/// A leading "<context>_" on the word is also tried without it (slot_width in [stator.slot]).
std::string nearest(std::string_view word, const std::vector<std::string>& candidates,
                    std::string_view context = {});

/// A value as it would be written in TOML, for messages: 0.012, 36.0, "open", nan.
std::string format_value(const toml::node& node);

/// Throws InputError "<path>:<line>: <subject>: <problem>; expected <expected>".
[[noreturn]] void fail(const Document& doc, int line, std::string_view subject, std::string_view problem,
                       std::string_view expected);

/// Throws InputError at the line of a key given by its dotted path ("stator.slot.width").
/// A key that is absent (its default was used) is reported at the line of its table.
[[noreturn]] void fail_at_key(const Document& doc, std::string_view dotted_key, std::string_view problem,
                              std::string_view expected);

/// One table of a case file and the keys it may hold. Refers to the Document; keep that alive.
class Fields {
 public:
  /// The top level of the document. Throws InputError if it holds a key not in `keys`.
  Fields(const Document& doc, std::vector<std::string> keys);

  /// A required sub-table; throws InputError if it is missing, not a table, or holds unknown keys.
  Fields table(std::string_view key, std::vector<std::string> keys) const;
  /// An optional sub-table; nothing if the key is absent.
  std::optional<Fields> optional_table(std::string_view key, std::vector<std::string> keys) const;

  /// A required real number; an integer is accepted. Non-finite values are out of range.
  double real(std::string_view key, const RealRange& range) const;
  double real_or(std::string_view key, double fallback, const RealRange& range) const;

  /// A required integer; a floating-point value (even 36.0) is refused.
  int integer(std::string_view key, const IntRange& range) const;
  int integer_or(std::string_view key, int fallback, const IntRange& range) const;

  std::string text_or(std::string_view key, std::string fallback) const;
  bool boolean_or(std::string_view key, bool fallback) const;

  /// A required string that must be one of `choices`; returns its index in `choices`.
  std::size_t choice(std::string_view key, const std::vector<std::string>& choices) const;
  std::size_t choice_or(std::string_view key, const std::vector<std::string>& choices, std::size_t fallback) const;

  bool has(std::string_view key) const;

  /// A required array (its elements are read by the functions in toml_arrays.hpp).
  const toml::array& array(std::string_view key, std::string_view expected) const;
  /// Throws InputError at the line of `node`, an element of one of this table's arrays;
  /// the subject reads "[table] key[index]".
  [[noreturn]] void fail_at(const toml::node& node, std::string_view key, std::string_view index,
                            std::string_view problem, std::string_view expected) const;

  /// Fails if `key` is present: used for keys that another setting makes meaningless (noted, and
  /// reading goes on, when the document collects its errors).
  void reject(std::string_view key, std::string_view problem, std::string_view expected) const;

  /// Throws InputError at the key's line (or the table's line if the key is absent). Always throws:
  /// the reader of a part of the case stops there (case_reader.cpp notes it and reads on).
  [[noreturn]] void fail(std::string_view key, std::string_view problem, std::string_view expected) const;

  /// Dotted name of this table ("stator.slot"); empty for the top level.
  const std::string& name() const { return name_; }
  /// Line of the table's header; 1 for the top level.
  int line() const;

 private:
  Fields(const Document& doc, const toml::table& table, std::string name, std::vector<std::string> keys,
         bool absent = false);
  void check_unknown_keys();
  InputError unknown_key(const std::string& word, const toml::node& node) const;
  double strict_real(std::string_view key, const RealRange& range) const;
  int strict_integer(std::string_view key, const IntRange& range) const;
  std::size_t strict_choice(std::string_view key, const std::vector<std::string>& choices) const;
  /// `read()`, or, when the document collects its errors, `stand_in` after noting what read() threw.
  /// A table that was missing or wrong gives stand-ins without a word: it was blamed once already.
  template <class T, class Read>
  T recovered(T stand_in, Read read) const;
  const toml::node& required(std::string_view key, std::string_view expected) const;
  std::string child_name(std::string_view key) const;
  std::string subject(std::string_view key) const;
  void check_declared(std::string_view key) const;

  const Document* doc_;
  const toml::table* table_;
  std::string name_;
  std::vector<std::string> keys_;
  bool absent_ = false;       ///< stands in for a table that is missing or not a table
  /// The keys this table's unknown keys most likely stand for (misspelt), which are then not
  /// blamed as missing too; with an unknown key too far from any to guess, no missing key is.
  std::vector<std::string> misspelt_;
  bool unguessed_ = false;
  bool stands_for_unknown(std::string_view key) const;
  /// A choice of this table (which decides the keys it may hold) was wrong: the rest is not read.
  mutable bool quiet_ = false;
};

}  // namespace tf::input
