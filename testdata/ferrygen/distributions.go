package main

import (
	"math"
	"math/rand/v2"
	"strconv"
)

// distributionSets are the data of the distribution and range charts.
// Each has its own fixed stream number, apart from the position-numbered
// streams of datasets, so that adding a data set anywhere changes no other.
var distributionSets = []struct {
	file   string
	stream uint64
	make   func(rng *rand.Rand) [][]string
}{
	{"crossings.csv", 101, crossings},
	{"delays.csv", 102, delays},
	{"temperatures.csv", 103, temperatures},
}

// crossings gives the time each sailing of a week in late autumn took,
// per route: the timetabled length, a right-skewed spread of a few minutes
// from loading and weather, and a handful of storm-delayed sailings far
// beyond. The night sailing runs four times a week only.
func crossings(rng *rand.Rand) [][]string {
	rows := [][]string{{"route", "crossing_min"}}
	chosen := []struct {
		r        route
		sailings int
		spread   float64
	}{
		{network[1], 84, 2.5}, {network[2], 112, 1.2}, {network[4], 70, 2},
		{network[6], 56, 4.5}, {network[0], 42, 6}, {network[3], 35, 3.5},
		{network[13], 14, 7}, {network[18], 4, 9},
	}
	for _, c := range chosen {
		for range c.sailings {
			v := float64(c.r.minutes) + c.spread*(rng.NormFloat64()*0.6+rng.ExpFloat64()*0.8)
			if rng.Float64() < 0.03 {
				v += float64(c.r.minutes) * (0.3 + 0.5*rng.Float64()) // a storm crossing
			}
			rows = append(rows, []string{c.r.name, round(math.Max(v, float64(c.r.minutes)*0.85), 1)})
		}
	}
	return rows
}

// delays gives the departure delay of every sailing of one route over a
// quarter, whole minutes: most leave within a few minutes, a long tail of
// waits for connecting trains and loading, and a few hours-long storm holds.
func delays(rng *rand.Rand) [][]string {
	rows := [][]string{{"sailing", "delay_min"}}
	for i := range 1400 {
		v := rng.ExpFloat64() * 4.5
		switch u := rng.Float64(); {
		case u < 0.22:
			v = 0
		case u < 0.30:
			v += 10 + rng.ExpFloat64()*8 // waiting for a connection
		case u < 0.31:
			v += 35 + rng.Float64()*30 // held by weather
		}
		rows = append(rows, []string{strconv.Itoa(i + 1), strconv.Itoa(int(math.Round(v)))})
	}
	return rows
}

// temperatures gives the mean air temperature of each month on the
// operator's largest island from 2000 to 2025, °C: a mild oceanic cycle,
// a slow warming, year-to-year noise, and a warm 2025.
func temperatures(rng *rand.Rand) [][]string {
	rows := [][]string{{"month", "year", "temp_c"}}
	names := []string{"Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"}
	for year := 2000; year <= 2025; year++ {
		for m, name := range names {
			season := 9.8 - 4.6*math.Cos(2*math.Pi*(float64(m)-0.6)/12)
			v := season + 0.025*float64(year-2000) + rng.NormFloat64()*1.1
			if year == 2025 {
				v += 0.9
			}
			rows = append(rows, []string{name, strconv.Itoa(year), round(v, 1)})
		}
	}
	return rows
}
