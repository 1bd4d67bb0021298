package server

import (
	"strconv"
	"unicode/utf8"

	"go.lsp.dev/protocol"
)

// appendPublishDiagnostics appends the JSON of p. A long page's
// diagnostics are the largest message the server sends after every edit,
// and a reflection-based encoder spends about 2 µs on each (protocol
// v0.12.0 declares severities and tags as float64 and codes as interface
// values); this one writes the few types it meets directly, about ten
// times faster. encode_test.go checks it against encoding/json.
func appendPublishDiagnostics(b []byte, p *publishDiagnosticsParams) []byte {
	b = append(b, `{"uri":`...)
	b = appendString(b, string(p.URI))
	if p.Version != nil {
		b = append(b, `,"version":`...)
		b = strconv.AppendInt(b, int64(*p.Version), 10)
	}
	b = append(b, `,"diagnostics":[`...)
	for i := range p.Diagnostics {
		if i > 0 {
			b = append(b, ',')
		}
		b = appendDiagnostic(b, &p.Diagnostics[i])
	}
	return append(b, "]}"...)
}

// plain reports whether p holds only what appendPublishDiagnostics
// writes: string codes, no code descriptions, no data.
func plain(p *publishDiagnosticsParams) bool {
	for i := range p.Diagnostics {
		d := &p.Diagnostics[i]
		if _, str := d.Code.(string); (d.Code != nil && !str) || d.CodeDescription != nil || d.Data != nil {
			return false
		}
	}
	return true
}

func appendDiagnostic(b []byte, d *protocol.Diagnostic) []byte {
	return appendDiagnosticCuts(b, d, nil)
}

// appendDiagnosticCuts is appendDiagnostic that also records in cuts,
// when not nil, the offset of every line number it writes, so that the
// JSON of a line's diagnostics can be moved to another line by rewriting
// only those numbers (linecache.go).
func appendDiagnosticCuts(b []byte, d *protocol.Diagnostic, cuts *[]int) []byte {
	b = append(b, `{"range":`...)
	b = appendRangeCuts(b, d.Range, cuts)
	if d.Severity != 0 {
		b = append(b, `,"severity":`...)
		b = strconv.AppendInt(b, int64(d.Severity), 10)
	}
	if code, ok := d.Code.(string); ok && code != "" {
		b = append(b, `,"code":`...)
		b = appendString(b, code)
	}
	if d.Source != "" {
		b = append(b, `,"source":`...)
		b = appendString(b, d.Source)
	}
	b = append(b, `,"message":`...)
	b = appendString(b, d.Message)
	if len(d.Tags) > 0 {
		b = append(b, `,"tags":[`...)
		for i, t := range d.Tags {
			if i > 0 {
				b = append(b, ',')
			}
			b = strconv.AppendInt(b, int64(t), 10)
		}
		b = append(b, ']')
	}
	if len(d.RelatedInformation) > 0 {
		b = append(b, `,"relatedInformation":[`...)
		for i, r := range d.RelatedInformation {
			if i > 0 {
				b = append(b, ',')
			}
			b = append(b, `{"location":{"uri":`...)
			b = appendString(b, string(r.Location.URI))
			b = append(b, `,"range":`...)
			b = appendRangeCuts(b, r.Location.Range, cuts)
			b = append(b, `},"message":`...)
			b = appendString(b, r.Message)
			b = append(b, '}')
		}
		b = append(b, ']')
	}
	return append(b, '}')
}

func appendRange(b []byte, r protocol.Range) []byte { return appendRangeCuts(b, r, nil) }

func appendRangeCuts(b []byte, r protocol.Range, cuts *[]int) []byte {
	b = append(b, `{"start":{"line":`...)
	if cuts != nil {
		*cuts = append(*cuts, len(b))
	}
	b = strconv.AppendUint(b, uint64(r.Start.Line), 10)
	b = append(b, `,"character":`...)
	b = strconv.AppendUint(b, uint64(r.Start.Character), 10)
	b = append(b, `},"end":{"line":`...)
	if cuts != nil {
		*cuts = append(*cuts, len(b))
	}
	b = strconv.AppendUint(b, uint64(r.End.Line), 10)
	b = append(b, `,"character":`...)
	b = strconv.AppendUint(b, uint64(r.End.Character), 10)
	return append(b, "}}"...)
}

// appendString appends s as a JSON string (RFC 8259, section 7): quote,
// backslash and control characters escaped, invalid UTF-8 replaced by
// U+FFFD, everything else as it is.
func appendString(b []byte, s string) []byte {
	const hex = "0123456789abcdef"
	b = append(b, '"')
	start := 0
	for i := 0; i < len(s); {
		c := s[i]
		if c >= 0x20 && c != '"' && c != '\\' && c < utf8.RuneSelf {
			i++
			continue
		}
		if c >= utf8.RuneSelf {
			r, size := utf8.DecodeRuneInString(s[i:])
			if r == utf8.RuneError && size == 1 {
				b = append(b, s[start:i]...)
				b = append(b, `\ufffd`...)
				i += size
				start = i
				continue
			}
			i += size
			continue
		}
		b = append(b, s[start:i]...)
		switch c {
		case '"', '\\':
			b = append(b, '\\', c)
		case '\n':
			b = append(b, '\\', 'n')
		case '\r':
			b = append(b, '\\', 'r')
		case '\t':
			b = append(b, '\\', 't')
		default:
			b = append(b, '\\', 'u', '0', '0', hex[c>>4], hex[c&0xf])
		}
		i++
		start = i
	}
	b = append(b, s[start:]...)
	return append(b, '"')
}
