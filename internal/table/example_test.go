package table_test

import (
	"fmt"
	"strings"
	"time"

	"plumb/internal/table"
)

// A semicolon-separated export with decimal commas, grouping, a currency
// sign and a missing marker reads without options.
func ExampleTable_ReadNumbers() {
	data := "town;budget\nAltdorf;1.234.567,50 €\nBergheim;987,25 €\nSeeburg;–\n"
	t, err := (&table.Reader{}).Read(strings.NewReader(data), "budget.csv")
	if err != nil {
		fmt.Println(err)
		return
	}
	n, err := t.ReadNumbers("budget")
	fmt.Println(n.Values, n.Missing, n.Unit, err)
	for _, note := range append(t.Notes, n.Notes...) {
		fmt.Println(note.Code)
	}
	// Output:
	// [1.2345675e+06 987.25 NaN] [2] € <nil>
	// separator
	// missing
	// decimal-comma
	// grouping
	// unit
}

// Day-first dates are read once a day above 12 proves the order.
func ExampleTable_Times() {
	data := "date,visitors\n03/01/2023,120\n17/01/2023,135\n"
	t, _ := (&table.Reader{}).Read(strings.NewReader(data), "visits.csv")
	secs, notes, err := t.Times("date", "")
	for _, s := range secs {
		fmt.Print(time.Unix(int64(s), 0).UTC().Format("2006-01-02 "))
	}
	fmt.Println(err)
	fmt.Println(notes[0].Text)

	data = "date,visitors\n03/01/2023,120\n04/01/2023,135\n"
	t, _ = (&table.Reader{}).Read(strings.NewReader(data), "visits.csv")
	_, _, err = t.Times("date", "")
	fmt.Println(err)
	// Output:
	// 2023-01-03 2023-01-17 <nil>
	// read column "date" as dates written DD/MM/YYYY, as "17/01/2023" on line 3 shows (say --x-format to choose)
	// visits.csv: line 2, column "date": cannot tell the day from the month in dates such as "03/01/2023"; no day is above 12, so the order is not shown; say --x-format DD/MM/YYYY (day first) or --x-format MM/DD/YYYY (month first)
}
