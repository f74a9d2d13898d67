package static

import "strings"

// SqueezeJS drops what a script carries only for its readers: the
// indentation and trailing spaces of each line, blank lines, and lines
// that hold nothing but a // comment. Every other line keeps its text
// and its line break, so no two tokens join and automatic semicolon
// insertion sees the same line breaks. It applies only where a line
// break cannot fall inside a literal: when a line ends with a backslash
// (a string continued on the next line) or holds an odd number of
// backquotes (a template literal over several lines), or a // line
// holds "*/" (the end of a block comment, code may follow), SqueezeJS
// returns the script unchanged and false.
func SqueezeJS(src string) (string, bool) {
	lines := strings.Split(src, "\n")
	for _, l := range lines {
		l = strings.TrimRight(l, " \t\r")
		// A // line that closes a block comment carries code after it.
		line := strings.TrimLeft(l, " \t")
		if strings.HasSuffix(l, `\`) || strings.Count(l, "`")%2 != 0 || strings.HasPrefix(line, "//") && strings.Contains(line, "*/") {
			return src, false
		}
	}
	var b strings.Builder
	b.Grow(len(src))
	for _, l := range lines {
		l = strings.Trim(l, " \t\r")
		if l == "" || strings.HasPrefix(l, "//") {
			continue
		}
		if b.Len() > 0 {
			b.WriteByte('\n')
		}
		b.WriteString(l)
	}
	return b.String(), true
}

// SqueezeCSS drops the comments of a stylesheet (but one between two
// non-blank characters, which separates them), the indentation and
// trailing spaces of its lines and its blank lines. It reads strings
// ("…", '…') and unquoted url(…) as they are, so a "/*" inside one stays.
// A stylesheet with an unclosed comment, string or url( is returned
// unchanged, with false.
func SqueezeCSS(src string) (string, bool) {
	var out strings.Builder
	out.Grow(len(src))
	for i := 0; i < len(src); {
		switch c := src[i]; {
		case strings.HasPrefix(src[i:], "/*"):
			end := strings.Index(src[i+2:], "*/")
			if end < 0 {
				return src, false
			}
			// A comment between two non-blanks separates them: it stays.
			next := i + 2 + end + 2
			if i > 0 && !isBlank(src[i-1]) && next < len(src) && !isBlank(src[next]) {
				out.WriteString(src[i:next])
			}
			i = next
		case c == '"' || c == '\'':
			j := i + 1
			for j < len(src) && src[j] != c && src[j] != '\n' {
				if src[j] == '\\' {
					j++
				}
				j++
			}
			if j >= len(src) || src[j] != c {
				return src, false
			}
			out.WriteString(src[i : j+1])
			i = j + 1
		case strings.HasPrefix(src[i:], "url(") && (i == 0 || !isNameByte(src[i-1])):
			rest := strings.TrimLeft(src[i+4:], " \t\n")
			if rest != "" && (rest[0] == '"' || rest[0] == '\'') {
				out.WriteString("url(") // a quoted url: the string case reads it
				i += 4
				continue
			}
			end := strings.IndexByte(src[i:], ')')
			if end < 0 {
				return src, false
			}
			out.WriteString(src[i : i+end+1])
			i += end + 1
		default:
			out.WriteByte(c)
			i++
		}
	}
	var b strings.Builder
	b.Grow(out.Len())
	for _, l := range strings.Split(out.String(), "\n") {
		l = strings.Trim(l, " \t\r")
		if l == "" {
			continue
		}
		if b.Len() > 0 {
			b.WriteByte('\n')
		}
		b.WriteString(l)
	}
	return b.String(), true
}

// isNameByte reports whether c can be part of a CSS identifier (ASCII).
func isNameByte(c byte) bool {
	return c == '-' || c == '_' || c >= '0' && c <= '9' || c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= 0x80
}

func isBlank(c byte) bool { return c == ' ' || c == '\t' || c == '\n' || c == '\r' || c == '\f' }
