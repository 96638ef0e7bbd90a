package main

import (
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// readmeCommand is one "$ plumb ..." line of the README's errors section,
// with the stderr lines shown under it and, when an "echo $?" follows, the
// exit code.
type readmeCommand struct {
	args []string
	want []string
	code int // -1 when the README does not show it
}

// readmeErrorSection returns the commands of the README's "Errors and
// notes" section. Long messages are wrapped in the README: a line that
// starts neither a message ("plumb: "), nor a command ("$ "), nor the
// usage hint is joined to the line before it with a space.
func readmeErrorSection(t *testing.T) []readmeCommand {
	t.Helper()
	b, err := os.ReadFile("../../README.md")
	require.NoError(t, err)
	text := string(b)
	start := strings.Index(text, "### Errors and notes")
	end := strings.Index(text, "### Charts and flags")
	require.True(t, start >= 0 && end > start, "the README has its errors section")
	var cmds []readmeCommand
	blocks := strings.Split(text[start:end], "```")
	for i := 1; i < len(blocks); i += 2 {
		var cur *readmeCommand
		echo := false
		for _, line := range strings.Split(strings.Trim(blocks[i], "\n"), "\n") {
			switch {
			case line == "$ echo $?":
				echo = true
			case strings.HasPrefix(line, "$ plumb "):
				require.NotContains(t, line, `"`, "README commands are split on spaces; keep them unquoted")
				cmds = append(cmds, readmeCommand{args: strings.Fields(line)[2:], code: -1})
				cur = &cmds[len(cmds)-1]
			case echo:
				code, err := strconv.Atoi(line)
				require.NoError(t, err, line)
				cur.code = code
				echo = false
			case strings.HasPrefix(line, "plumb: "), strings.HasPrefix(line, "Run '"):
				cur.want = append(cur.want, line)
			default:
				require.NotEmpty(t, cur.want, "a continuation line follows a message: %q", line)
				cur.want[len(cur.want)-1] += " " + line
			}
		}
	}
	return cmds
}

// TestReadmeErrorMessages runs every command of the README's errors section
// on invented files and requires exactly the messages the README shows.
func TestReadmeErrorMessages(t *testing.T) {
	cmds := readmeErrorSection(t)
	require.GreaterOrEqual(t, len(cmds), 12)
	dir := t.TempDir()
	writeFile(t, dir, "scores.csv", "school,score\nAsh Lane,78\nBirch Hill,85\nCedar Park,91\nDale End,66\nElm Row,72\n")
	writeFile(t, dir, "sales.csv", "region,revenue\nNorth,120\nSouth,340\nEast,95\nWest,410\nCentre,260\nCoast,\"12,3x\"\n")
	writeFile(t, dir, "orders.csv", "order,product,amount\n1,Tea,12\n2,Coffee,30\n3,Tea,8\n4,Cocoa,5\n5,Coffee,22\n6,Juice,9\n7,Water,4\n8,Tea,6\n")
	require.NoError(t, os.Mkdir(filepath.Join(dir, "figures"), 0o755))
	t.Chdir(dir)
	for _, c := range cmds {
		t.Run(strings.Join(c.args, " "), func(t *testing.T) {
			args := c.args
			if i := len(args) - 2; i >= 0 && args[i] == ">" {
				args = args[:i] // standard output goes to the test's buffer
			}
			code, _, stderr := plumb(t, "", args...)
			got := strings.Split(strings.TrimSuffix(stderr, "\n"), "\n")
			assert.Equal(t, c.want, got)
			if c.code >= 0 {
				assert.Equal(t, c.code, code)
			}
		})
	}
}

// TestReadmeGalleryShowsEveryGolden keeps the README's gallery current:
// every pinned figure in golden/ is shown there.
func TestReadmeGalleryShowsEveryGolden(t *testing.T) {
	readme, err := os.ReadFile("../../README.md")
	require.NoError(t, err)
	var files []string
	for _, pattern := range []string{"*.svg", "png/*.png"} {
		m, err := filepath.Glob(filepath.Join(goldenDir, pattern))
		require.NoError(t, err)
		files = append(files, m...)
	}
	require.NotEmpty(t, files)
	for _, f := range files {
		rel, err := filepath.Rel("../..", f)
		require.NoError(t, err)
		assert.Contains(t, string(readme), "("+filepath.ToSlash(rel)+")", "README gallery shows %s", rel)
	}
}
