package render

// An OptionError is an option value a chart cannot use: a Top of 1, an
// unknown Other mode, a width that is not a finite positive number. Option
// is the name of the options field (such as "Top", "Other" or "Width"), so
// that a caller can tell which one was wrong with errors.As and name it in
// its own words: the plumb command prints "--top 1: ..." for an
// OptionError{Option: "Top", Value: "1"}.
type OptionError struct {
	Option string // the field of the options struct, such as "Top"
	Value  string // the value given, as text; strings are quoted ("\"x\"")
	Err    error  // what is wrong and what would work
}

// Error reads "Top 1: show at least 2 categories".
func (e *OptionError) Error() string {
	s := e.Option
	if e.Value != "" {
		s += " " + e.Value
	}
	if e.Err != nil {
		s += ": " + e.Err.Error()
	}
	return s
}

// Unwrap returns the cause, so that errors.Is sees through the option.
func (e *OptionError) Unwrap() error { return e.Err }

// OptionNames says how errors and notes refer to options: a message that
// suggests another setting ("show more with Top") names the option by its
// entry here, or by its field name when it has none. The plumb command maps
// every option to its flag ("Top" to "--top"), so that its messages name
// what its user types; a nil map names the fields, as a Go caller sets them.
// The Option of an OptionError is always the field name.
type OptionNames map[string]string

// name is how messages refer to option.
func (n OptionNames) name(option string) string {
	if s, ok := n[option]; ok && s != "" {
		return s
	}
	return option
}

// name is how this chart's messages refer to option.
func (c Common) name(option string) string { return c.Names.name(option) }
