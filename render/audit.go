package render

// TextFloor is the medium's smallest text size in pixels: the size below
// which no text of a figure for it should be set (see mediumSpec). A
// reviewer of scenes (plumb audit) compares every Text mark's Size with
// it; an unknown medium is an error.
func (m Medium) TextFloor() (float64, error) {
	sp, err := m.spec()
	if err != nil {
		return 0, err
	}
	return sp.floor, nil
}
